// @vitest-environment jsdom
// The flatplan in the DOM: a final page drawn trimmed and placed by its fit, a pass or nothing
// standing in marked "not final", each page's preflight level in words, and the switch between
// reader and printer spreads (pressed state, the sheets' sides for saddle stitch, a plain note
// for perfect binding). The preflight comes through its SWR key, as on the volume page.
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { SWRConfig } from 'swr';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { FlatplanView } from '@/components/volume/flatplan';
import type { Flatplan } from '@/db/queries/volumes';
import { DEFAULT_VOLUME_SPEC, type VolumeSpec } from '@/lib/print/book';

afterEach(cleanup);
beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(JSON.stringify(PREFLIGHT), { headers: { 'content-type': 'application/json' } })),
  );
});

const SPEC: VolumeSpec = { ...DEFAULT_VOLUME_SPEC, trimW: 150, trimH: 150, bleed: 3 };

const page = (number: number, over: Partial<Flatplan['pages'][number]>): Flatplan['pages'][number] => ({
  number,
  kind: 'gag',
  entryId: `e${number}`,
  title: `Gag ${number}`,
  status: 'inked',
  latestPass: null,
  final: null,
  ...over,
});

const DATA: Flatplan = {
  pages: [
    page(1, {
      kind: 'cover',
      title: null,
      status: null,
      final: { id: 'f1', width: 600, height: 900, colour: 'line', version: 'abc', fit: { to: 'trim', x: 0, y: 0, scale: 1, rotation: 90 } },
    }),
    page(2, { latestPass: { id: 'p2', seq: 7 } }),
    page(3, {}),
    page(4, { kind: 'afterword', title: null, status: null }),
  ],
  spreads: [
    [null, 1],
    [2, 3],
    [4, null],
  ],
  pageCountValid: true,
  blanksNeeded: 0,
  blanksAt: 3,
  spineMm: null,
  sheets: 1,
  printerSpreads: [
    [4, 1],
    [2, 3],
  ],
  notReady: [],
};

const check = (rule: string, level: string) => ({ rule, level, message: `${rule} says ${level}`, source: 'common practice' });
const PREFLIGHT = {
  note: "The printer's own specification takes precedence.",
  pages: [
    { number: 1, entryId: 'e1', kind: 'cover', ppi: { x: 600, y: 600 }, level: 'ok', checks: [check('resolution', 'ok')] },
    { number: 2, entryId: 'e2', kind: 'gag', ppi: null, level: 'fail', checks: [check('missing', 'fail')] },
    { number: 3, entryId: 'e3', kind: 'gag', ppi: null, level: 'fail', checks: [check('missing', 'fail')] },
    { number: 4, entryId: 'e4', kind: 'afterword', ppi: null, level: 'warn', checks: [check('bleed', 'warn'), check('cut-band', 'warn')] },
  ],
  book: { pages: 4, binding: 'saddle', blanksToAdd: 0, level: 'fail', checks: [] },
};

function show(data: Flatplan, spec: VolumeSpec = SPEC) {
  return render(
    <SWRConfig value={{ provider: () => new Map(), fallback: { '/api/volumes/v1/preflight': PREFLIGHT } }}>
      <FlatplanView data={data} spec={spec} volumeId="v1" />
    </SWRConfig>,
  );
}

describe('FlatplanView', () => {
  it('draws a final page trimmed and placed by its fit, and marks the stand-ins "not final"', () => {
    show(DATA);
    const pages = screen.getAllByTestId('flatplan-page');
    expect(pages.map((p) => p.dataset.final)).toEqual(['yes', 'no', 'no', 'no']);
    const svg = within(pages[0]!).getByRole('img', { name: 'Page 1, Cover: final page' });
    // The reader sees the trimmed page: the view box is the trim (150 × 150 mm), the scan clipped to it.
    expect(svg.getAttribute('viewBox')).toBe('0 0 150 150');
    const image = svg.querySelector('image')!;
    expect(image.getAttribute('href')).toBe('/api/final-pages/f1/image/preview?v=abc');
    expect(svg.querySelector('g')!.getAttribute('clip-path')).toMatch(/^url\(#trim-/);
    // A 600 × 900 px scan turned a quarter covers the 150 mm trim: turned it is 900 × 600, scaled by
    // max(150/900, 150/600) = 0.25 to 225 × 150 mm, centred at (75, 75); drawn unturned as 150 × 225 and turned 90°.
    expect([image.getAttribute('x'), image.getAttribute('y'), image.getAttribute('width'), image.getAttribute('height')]).toEqual([
      '-75',
      '-112.5',
      '150',
      '225',
    ]);
    expect(image.getAttribute('transform')).toBe('translate(75 75) rotate(90)');
    // The pass stands in, with its seq in the address; a page with neither says its name.
    expect(within(pages[1]!).getByRole('img', { name: 'Page 2, Gag 2: newest pass, not final' }).getAttribute('src')).toBe(
      '/api/passes/p2/thumbnail.svg?v=7',
    );
    expect(screen.getAllByTestId('flatplan-not-final')).toHaveLength(3);
    expect(within(pages[0]!).queryByTestId('flatplan-not-final')).toBeNull();
  });

  it("puts each page's preflight level beside it in words, with the rules that flag it", async () => {
    show(DATA);
    const marks = await screen.findAllByTestId('flatplan-preflight');
    expect(marks.map((m) => [m.dataset.level, m.textContent])).toEqual([
      ['ok', 'OK'],
      ['fail', 'Must fix: no final page'],
      ['fail', 'Must fix: no final page'],
      ['warn', 'Warning: bleed, may be cut'],
    ]);
    expect(marks[3]!.getAttribute('title')).toBe('bleed says warn\ncut-band says warn');
  });

  it('switches to printer spreads: the sides of the saddle-stitched sheets', () => {
    show(DATA);
    const reader = screen.getByRole('button', { name: 'Reader spreads' });
    const printer = screen.getByRole('button', { name: 'Printer spreads' });
    expect(reader.getAttribute('aria-pressed')).toBe('true');
    expect(printer.getAttribute('aria-pressed')).toBe('false');
    fireEvent.click(printer);
    expect(printer.getAttribute('aria-pressed')).toBe('true');
    expect(screen.getAllByTestId('printer-spread').map((g) => g.getAttribute('aria-label'))).toEqual([
      'Sheet 1, outside: page 4 and page 1',
      'Sheet 1, inside: page 2 and page 3',
    ]);
    expect(screen.getAllByTestId('flatplan-page').map((p) => within(p).getByText(/^\d+$/).textContent)).toEqual(['4', '1', '2', '3']);
    expect(screen.getByTestId('flatplan-figures').textContent).toMatch(/Confirm with your printer/);
  });

  it('says plainly what printer spreads are for a perfect-bound book, and for a count saddle stitching cannot take', () => {
    const perfect = show({ ...DATA, printerSpreads: [] }, { ...SPEC, binding: 'perfect' });
    fireEvent.click(screen.getByRole('button', { name: 'Printer spreads' }));
    expect(screen.getByTestId('printer-spreads-note').textContent).toMatch(/perfect-bound book has no printer spreads.*Confirm with your printer/);
    expect(screen.queryAllByTestId('flatplan-page')).toHaveLength(0);
    perfect.unmount();
    show({
      ...DATA,
      pages: DATA.pages.slice(0, 3),
      spreads: [
        [null, 1],
        [2, 3],
      ],
      pageCountValid: false,
      blanksNeeded: 1,
      printerSpreads: [],
    });
    // The page-count warning names the blank to add and where, and that printers differ.
    const warning = within(screen.getByTestId('flatplan-warnings')).getByRole('listitem');
    expect(warning.textContent).toMatch(
      /^3 pages cannot be saddle stitched \(it takes a multiple of 4\): add 1 blank page, best after page 3 .*Printers differ on the counts they take: confirm with your printer\.$/,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Printer spreads' }));
    expect(screen.getByTestId('printer-spreads-note').textContent).toMatch(/multiple of 4: add 1 blank page first/);
  });
});
