// Pure parts of the final pages: the JPEG metadata filter (segments per ITU-T T.81 Annex B),
// the fit geometry (1 in = 25.4 mm), and how the gag's status follows the art (PRODUCT.md).
import { describe, expect, it } from 'vitest';
import { checkArtMove, statusFromArt } from '@/lib/gags/status';
import { defaultFit, pageToScan, placedBox, placedPpi, scanToPage } from '@/lib/print/final-fit';
import { stripJpegMetadata } from '@/lib/uploads/jpeg-strip';

const seg = (marker: number, body: string | Buffer) => {
  const b = typeof body === 'string' ? Buffer.from(body, 'latin1') : body;
  const head = Buffer.alloc(4);
  head.writeUInt16BE(0xff00 | marker, 0);
  head.writeUInt16BE(b.length + 2, 2);
  return Buffer.concat([head, b]);
};

describe('stripJpegMetadata', () => {
  const SOI = Buffer.from([0xff, 0xd8]);
  const scan = Buffer.concat([seg(0xda, Buffer.from([1, 1, 0, 0, 0x3f, 0])), Buffer.from([0x12, 0x34, 0xff, 0x00, 0x56, 0xff, 0xd9])]);
  const file = Buffer.concat([
    SOI,
    seg(0xe0, 'JFIF\0\x01\x02\x01\x01\x2c\x01\x2c\0\0'),
    seg(0xe1, 'Exif\0\0GPS here'),
    seg(0xe1, 'http://ns.adobe.com/xap/1.0/\0<x:xmpmeta/>'),
    seg(0xe2, 'ICC_PROFILE\0\x01\x01profile'),
    seg(0xe2, 'MPF\0pictures'),
    seg(0xed, 'Photoshop 3.0\0IPTC'),
    seg(0xee, 'Adobe\0\x64\0\0\0\0\x01'),
    seg(0xfe, 'a comment'),
    seg(0xdb, Buffer.alloc(65, 1)),
    seg(0xc0, Buffer.from([8, 0, 16, 0, 16, 1, 1, 0x11, 0])),
    seg(0xc4, Buffer.alloc(20, 2)),
    scan,
  ]);
  it('drops Exif, XMP, MPF, IPTC and comments; keeps JFIF, ICC, Adobe, the tables, the frame and the scan byte for byte', () => {
    const out = stripJpegMetadata(file);
    const text = out.toString('latin1');
    for (const gone of ['Exif', 'GPS here', 'xmpmeta', 'MPF', 'IPTC', 'a comment']) expect(text).not.toContain(gone);
    for (const kept of ['JFIF', 'ICC_PROFILE', 'Adobe']) expect(text).toContain(kept);
    expect(out.subarray(out.length - scan.length).equals(scan)).toBe(true);
    expect(out.length).toBe(
      file.length -
        [
          seg(0xe1, 'Exif\0\0GPS here'),
          seg(0xe1, 'http://ns.adobe.com/xap/1.0/\0<x:xmpmeta/>'),
          seg(0xe2, 'MPF\0pictures'),
          seg(0xed, 'Photoshop 3.0\0IPTC'),
          seg(0xfe, 'a comment'),
        ].reduce((n, b) => n + b.length, 0),
    );
  });
  it('refuses what is not a well-formed JPEG', () => {
    expect(() => stripJpegMetadata(Buffer.from('GIF89a'))).toThrow();
    expect(() => stripJpegMetadata(Buffer.concat([SOI, Buffer.from([0xff, 0xe1, 0x40, 0x00, 1, 2])]))).toThrow(/past the end/);
    expect(() => stripJpegMetadata(Buffer.concat([SOI, seg(0xe0, 'JFIF\0')]))).toThrow(/no image data/);
  });
});

// A non-square trim (US 5.5 × 8.5 in digest size, 1/8 in bleed: common practice), so that a width
// and a height swapped anywhere shows.
const IN = 25.4;
const SPEC = { trimW: 5.5 * IN, trimH: 8.5 * IN, bleed: IN / 8, safe: 0.25 * IN, gutter: 4 };

describe('fit geometry', () => {
  it('scale 1, no offset: covers its box, centred; the effective ppi along each of the scan’s axes', () => {
    // Drawn at the bleed size, 5.75 × 8.75 in, scanned at 600 ppi: 3450 × 5250 px.
    const scan = { width: 3450, height: 5250 };
    const p = placedBox(SPEC, { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 }, scan);
    expect(p.x).toBeCloseTo(-IN / 8, 9);
    expect(p.y).toBeCloseTo(-IN / 8, 9);
    expect(p.w).toBeCloseTo(5.75 * IN, 9);
    expect(p.h).toBeCloseTo(8.75 * IN, 9);
    const ppi = placedPpi(p, scan);
    expect(ppi.x).toBeCloseTo(600, 9);
    expect(ppi.y).toBeCloseTo(600, 9);
    // To the trim, the same scan shrinks by the larger of 5.5 / 5.75 and 8.5 / 8.75 (cover): the height fits the
    // trim exactly and the width runs a little past it on both sides.
    const t = placedBox(SPEC, { to: 'trim', x: 0, y: 0, scale: 1, rotation: 0 }, scan);
    expect(t.h).toBeCloseTo(8.5 * IN, 9);
    expect(t.w).toBeCloseTo(5.75 * (8.5 / 8.75) * IN, 9);
    expect(placedPpi(t, scan).y).toBeCloseTo(5250 / 8.5, 6);
  });
  it('a quarter turn lays the scan’s width along the page’s height; offset and scale move and grow it', () => {
    const scan = { width: 5250, height: 3450 }; // scanned sideways
    const p = placedBox(SPEC, { to: 'bleed', x: 2, y: -3, scale: 1.1, rotation: 90 }, scan);
    expect(p.w).toBeCloseTo(5.75 * IN * 1.1, 9);
    expect(p.h).toBeCloseTo(8.75 * IN * 1.1, 9);
    expect(p.x + p.w / 2).toBeCloseTo((5.5 * IN) / 2 + 2, 9);
    expect(p.y + p.h / 2).toBeCloseTo((8.5 * IN) / 2 - 3, 9);
    const ppi = placedPpi(p, scan);
    expect(ppi.x).toBeCloseTo(5250 / (8.75 * 1.1), 6); // the scan's x axis runs down the page
    expect(ppi.y).toBeCloseTo(3450 / (5.75 * 1.1), 6);
  });
  it('page ↔ scan: the forward and inverse maps agree, and a clockwise turn puts the scan’s top-left at the top right', () => {
    const scan = { width: 400, height: 200 };
    for (const rotation of [0, 90, 180, 270] as const) {
      const p = placedBox(SPEC, { to: 'trim', x: 1, y: 2, scale: 0.9, rotation }, scan);
      for (const [px, py] of [
        [10, 20],
        [399, 1],
        [200, 150],
      ] as const) {
        const at = scanToPage(p, scan, px, py);
        const back = pageToScan(p, scan, at.x, at.y)!;
        expect(back.px).toBeCloseTo(px, 6);
        expect(back.py).toBeCloseTo(py, 6);
      }
    }
    const p90 = placedBox(SPEC, { to: 'trim', x: 0, y: 0, scale: 1, rotation: 90 }, scan);
    const corner = scanToPage(p90, scan, 0, 0);
    expect(corner.x).toBeCloseTo(p90.x + p90.w, 9);
    expect(corner.y).toBeCloseTo(p90.y, 9);
  });
  it('a new final page starts fitted to the bleed when the scan is the bleed box’s size at its recorded ppi, else to the trim', () => {
    expect(defaultFit(SPEC, { width: 3450, height: 5250, ppi: 600 }).to).toBe('bleed');
    expect(defaultFit(SPEC, { width: 3300, height: 5100, ppi: 600 }).to).toBe('trim'); // 5.5 × 8.5 in: the trim
    expect(defaultFit(SPEC, { width: 3450, height: 5250, ppi: null }).to).toBe('trim');
    expect(defaultFit({ ...SPEC, bleed: 0 }, { width: 3300, height: 5100, ppi: 600 }).to).toBe('trim');
  });
});

describe('status follows the art', () => {
  const none = { hasFinalPage: false, fitted: false, inRunningOrder: false };
  it('a final page makes "scanned"; fitted and in a running order, "placed"; without one, what people set', () => {
    expect(statusFromArt('inked', { ...none, hasFinalPage: true })).toBe('scanned');
    expect(statusFromArt('idea', { ...none, hasFinalPage: true, inRunningOrder: true })).toBe('scanned');
    expect(statusFromArt('scanned', { hasFinalPage: true, fitted: true, inRunningOrder: true })).toBe('placed');
    expect(statusFromArt('placed', { hasFinalPage: true, fitted: true, inRunningOrder: false })).toBe('scanned');
    expect(statusFromArt('placed', none)).toBe('placed');
    expect(statusFromArt('in_review', none)).toBe('in_review');
  });
  it('a move by hand to "scanned" or "placed" must agree with the art', () => {
    expect(checkArtMove('scanned', none).ok).toBe(false);
    expect(checkArtMove('scanned', { ...none, hasFinalPage: true }).ok).toBe(true);
    expect(checkArtMove('placed', { hasFinalPage: true, fitted: false, inRunningOrder: true }).ok).toBe(false);
    expect(checkArtMove('placed', { hasFinalPage: true, fitted: true, inRunningOrder: true }).ok).toBe(true);
    expect(checkArtMove('inked', none).ok).toBe(true);
  });
});
