// Exports checked with poppler (Debian's poppler-utils): pdfinfo -box and pdffonts.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as csvRoute from '@/app/api/volumes/[volumeId]/export/running-order.csv/route';
import * as reviewRoute from '@/app/api/volumes/[volumeId]/export/review.pdf/route';
import * as templatesRoute from '@/app/api/volumes/[volumeId]/export/templates.pdf/route';
import { DEMO_VOLUME_ID } from '@/db/seed/demo-data';
import { pdfBoxes } from '@/lib/print/book';
import { callRouteRaw } from '../support/call-route';
import { freshDb } from '../support/test-db';

beforeAll(async () => {
  await freshDb();
});

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'quadrille-pdf-'));
async function save(res: Response, name: string) {
  const file = path.join(dir, name);
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return file;
}

function boxes(file: string) {
  const out = execFileSync('pdfinfo', ['-box', '-f', '1', '-l', '999', file], { encoding: 'utf8' });
  const pages = Number(out.match(/^Pages:\s+(\d+)/m)![1]);
  const read = (kind: string) =>
    [...out.matchAll(new RegExp(`^Page\\s+(\\d+)\\s+${kind}:\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)`, 'gm'))].map((m) =>
      m.slice(2).map(Number),
    );
  return { pages, trim: read('TrimBox'), bleed: read('BleedBox'), media: read('MediaBox') };
}

describe('review dummy PDF', () => {
  it('one page per running-order entry, TrimBox and BleedBox equal to the spec within 0.01 pt, fonts embedded', async () => {
    const res = await callRouteRaw(reviewRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const file = await save(res, 'review.pdf');
    const b = boxes(file);
    expect(b.pages).toBe(9); // the demo running order: cover, title, six gags, afterword
    // 150 mm trim with 3 mm bleed; 1 pt = 1/72 in, 1 in = 25.4 mm.
    const want = pdfBoxes({ trimW: 150, trimH: 150, bleed: 3, safe: 5, gutter: 4 });
    expect(b.trim).toHaveLength(9);
    for (const t of b.trim) t.forEach((v, i) => expect(Math.abs(v - want.trim[i]!)).toBeLessThanOrEqual(0.01));
    for (const t of b.bleed) t.forEach((v, i) => expect(Math.abs(v - want.bleed[i]!)).toBeLessThanOrEqual(0.01));
    expect(want.trim[2] - want.trim[0]).toBeCloseTo(425.197, 3);
    const fonts = execFileSync('pdffonts', [file], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(fonts.length).toBeGreaterThan(0);
    // Columns end with: emb sub uni object-id generation. Every font must be embedded.
    for (const line of fonts) expect(line.match(/\s(yes|no)\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+$/)![1]).toBe('yes');
    const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
    expect(info).toMatch(/Subject:\s+Guidance only: the printer's own specification takes precedence\./);
  });
});

describe('drawing templates PDF', () => {
  it('A4 at 100 %, one page per gag; 200 % does not fit A4 and says so', async () => {
    const res = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=100&paper=A4' });
    expect(res.status).toBe(200);
    const file = await save(res, 'templates.pdf');
    const b = boxes(file);
    expect(b.pages).toBe(6);
    // ISO 216 A4: 210 × 297 mm = 595.28 × 841.89 pt
    expect(b.media[0]![2]).toBeCloseTo(595.28, 1);
    expect(b.media[0]![3]).toBeCloseTo(841.89, 1);
    const big = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=200&paper=A4' });
    expect(big.status).toBe(422);
    expect((await big.json()).error).toMatch(/does not fit on A4/);
    const bad = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=120' });
    expect(bad.status).toBe(422);
  });
  it('A3 at 150 %', async () => {
    const res = await callRouteRaw(templatesRoute.GET, { as: 'editor', params: { volumeId: DEMO_VOLUME_ID }, url: '/x?scale=150&paper=A3' });
    expect(res.status).toBe(200);
    const b = boxes(await save(res, 'templates-a3.pdf'));
    expect(b.media[0]![2]).toBeCloseTo(841.89, 1); // A3 297 mm wide
  });
});

describe('running order CSV', () => {
  it('lists the pages in order with the printer note first', async () => {
    const res = await callRouteRaw(csvRoute.GET, { as: 'viewer', params: { volumeId: DEMO_VOLUME_ID } });
    const text = await res.text();
    const lines = text.trim().split('\n');
    expect(lines[0]).toMatch(/printer's own specification takes precedence/);
    expect(lines[1]).toBe('page,kind,title,status,gag_id');
    expect(lines[2]).toBe('1,cover,Cover,,');
    expect(lines[4]).toBe('3,gag,Low Tide Lunch,placed,demo-gag-01');
    expect(lines).toHaveLength(11);
  });
});
