// The preflight computed from scans drawn pixel by pixel here (1 in = 25.4 mm; the ppi targets are
// common practice: line art 600, greyscale 300). The page is the demo's 150 mm square with 3 mm bleed
// and a 5 mm safe margin, or a non-square 5.5 × 8.5 in trim with 1/8 in bleed so a swapped axis shows.
import { describe, expect, it } from 'vitest';
import type { Fit } from '@/lib/print/final-fit';
import { bookPreflight, pagePreflight } from '@/lib/print/preflight';
import { ScanAnalyser, gridFor } from '@/lib/print/scan-analysis';

const SPEC = { trimW: 150, trimH: 150, bleed: 3, safe: 5, gutter: 4 };
type Paint = (xMm: number, yMm: number) => number | [number, number, number];

/** A scan `wMm × hMm` at `ppi`, each pixel's value from `paint` (mm from the scan's top left), fed to the analyser in odd-sized chunks. */
function scanOf(wMm: number, hMm: number, ppi: number, paint: Paint, channels: 1 | 3 = 1) {
  const width = Math.round((wMm / 25.4) * ppi);
  const height = Math.round((hMm / 25.4) * ppi);
  const a = new ScanAnalyser(width, height, channels);
  const row = new Uint8Array(width * channels);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const v = paint(((x + 0.5) / ppi) * 25.4, ((y + 0.5) / ppi) * 25.4);
      if (channels === 1) row[x] = v as number;
      else row.set(v as [number, number, number], x * 3);
    }
    // Chunks that split pixels: what a stream of raw bytes does.
    for (let at = 0; at < row.length; at += 1001) a.push(row.subarray(at, Math.min(row.length, at + 1001)));
  }
  return { width, height, analysis: a.result() };
}

const page = (scan: ReturnType<typeof scanOf>, colour: 'line' | 'grey' | 'rgb', fit: Fit) =>
  pagePreflight(SPEC, {
    number: 3,
    entryId: 'e3',
    gagId: 'g3',
    kind: 'gag',
    final: { id: 'f3', width: scan.width, height: scan.height, colour, fit },
    analysis: scan.analysis,
  });
const BLEED: Fit = { to: 'bleed', x: 0, y: 0, scale: 1, rotation: 0 };
const TRIM: Fit = { to: 'trim', x: 0, y: 0, scale: 1, rotation: 0 };
const rule = (p: ReturnType<typeof page>, name: string) => p.checks.filter((c) => c.rule === name);
/** Panel frames inside the safe area (5 mm in from the trim = 8 mm into a scan with its bleed). */
const panels: Paint = (x, y) => ((Math.abs(x - 10) < 0.3 || Math.abs(x - 146) < 0.3) && y > 10 && y < 146 ? 0 : 255);

describe('the scan analysis grid', () => {
  it('at most 256 cells along the longer side; shares of ink and colour per cell', () => {
    expect(gridFor(3685, 3685)).toEqual({ cell: 15, cols: 246, rows: 246 });
    const s = scanOf(20, 10, 100, (x) => (x < 10 ? [200, 20, 20] : [40, 40, 40]), 3);
    expect(s.analysis.colourPixels).toBe(Math.round((10 / 25.4) * 100) * s.height); // the red left half
    expect(s.analysis.ink[s.analysis.cols - 1]).toBe(255); // dark grey on the right is ink
  });
});

describe('resolution at the fitted size', () => {
  it('600 ppi line art fitted to the bleed: 600 ppi, ok', () => {
    const p = page(scanOf(156, 156, 600, panels), 'line', BLEED);
    expect(p.ppi!.x).toBeCloseTo(3685 / (156 / 25.4), 6); // 600.08: whole pixels over 156 mm
    expect(rule(p, 'resolution')[0]).toMatchObject({ level: 'ok' });
    expect(p.level).toBe('ok');
  });
  it('300 ppi: ok for greyscale tone, a warning with the figure for line art', () => {
    const s = scanOf(156, 156, 300, panels);
    expect(rule(page(s, 'grey', BLEED), 'resolution')[0]!.level).toBe('ok');
    const line = rule(page(s, 'line', BLEED), 'resolution')[0]!;
    expect(line.level).toBe('warn');
    expect(line.message).toMatch(/Only 300 ppi.*line art wants 600 ppi/);
  });
  it('a 150 ppi scan is soft for anything: warned with its figure, lower still when enlarged', () => {
    const s = scanOf(156, 156, 150, panels);
    const r = rule(page(s, 'grey', { ...BLEED, scale: 1.5 }), 'resolution')[0]!;
    expect(r.level).toBe('warn');
    expect(r.message).toMatch(/Only 100 ppi/); // 150 ppi spread over 1.5 × the size
  });
});

describe('colour in a greyscale book', () => {
  it('a red mark is flagged with how much and where on the page', () => {
    // A 156 mm scan fitted to the bleed: scan mm − 3 = page mm. Red square from 40 to 50 mm on the scan.
    const red: Paint = (x, y) => (x >= 40 && x < 50 && y >= 60 && y < 70 ? [210, 30, 30] : [250, 250, 250]);
    const p = page(scanOf(156, 156, 100, red, 3), 'rgb', BLEED);
    const c = rule(p, 'colour')[0]!;
    expect(c.level).toBe('warn');
    // 10 × 10 mm of 156 × 156 mm = 0.41 %
    expect(c.message).toMatch(/^0\.4 % of the scan's pixels are in colour/);
    const [x0, x1, y0, y1] = c.message
      .match(/within ([\d.]+)–([\d.]+) mm across and ([\d.]+)–([\d.]+) mm down/)!
      .slice(1)
      .map(Number);
    // Within a grid cell (156 mm / 246 cells ≈ 0.6 mm) of 37–47 mm across and 57–67 mm down.
    expect(Math.abs(x0! - 37)).toBeLessThan(0.7);
    expect(Math.abs(x1! - 47)).toBeLessThan(0.7);
    expect(Math.abs(y0! - 57)).toBeLessThan(0.7);
    expect(Math.abs(y1! - 67)).toBeLessThan(0.7);
  });
  it('a colour file with only greys is fine', () => {
    const p = page(
      scanOf(156, 156, 100, () => [120, 120, 120], 3),
      'rgb',
      BLEED,
    );
    expect(rule(p, 'colour')[0]!.level).toBe('ok');
  });
});

describe('bleed', () => {
  it('a scan stopping at the trim, with art to its edges: fails on every side with a 3.0 mm gap', () => {
    const p = page(
      scanOf(150, 150, 300, () => 90),
      'grey',
      TRIM,
    );
    const b = rule(p, 'bleed');
    expect(b.map((c) => c.level)).toEqual(['fail', 'fail', 'fail', 'fail']);
    expect(b.map((c) => c.message.match(/on the (\w+)/)![1])).toEqual(['left', 'right', 'top', 'bottom']);
    for (const c of b) expect(c.message).toMatch(/stops 3\.0 mm short of the bleed edge on the \w+ \(it stops at the trim\)/);
    expect(p.level).toBe('fail');
  });
  it('blank paper at the scan’s edges: the gap is a warning only; moved 2 mm right, the left gap grows and the right closes', () => {
    const b = rule(page(scanOf(150, 150, 300, panels), 'grey', TRIM), 'bleed');
    expect(b.map((c) => c.level)).toEqual(['warn', 'warn', 'warn', 'warn']);
    const moved = rule(page(scanOf(156, 156, 300, panels), 'grey', { ...BLEED, x: 2 }), 'bleed');
    expect(moved).toHaveLength(1);
    expect(moved[0]!.message).toMatch(/stops 2\.0 mm short of the bleed edge on the left/);
  });
  it('on a non-square trim the gaps follow the axes', () => {
    const IN = 25.4;
    const spec = { trimW: 5.5 * IN, trimH: 8.5 * IN, bleed: IN / 8, safe: 0.25 * IN, gutter: 4 };
    // Drawn 5.5 in wide but 8.75 in tall: covers the bleed top and bottom when fitted to the trim, not the sides.
    const s = scanOf(5.5 * IN, 8.75 * IN, 100, () => 90);
    const p = pagePreflight(spec, {
      number: 1,
      entryId: 'e',
      kind: 'gag',
      final: { id: 'f', width: s.width, height: s.height, colour: 'grey', fit: TRIM },
      analysis: s.analysis,
    });
    expect(rule(p, 'bleed').map((c) => c.message.match(/on the (\w+)/)![1])).toEqual(['left', 'right']);
  });
});

describe('ink in the cut band', () => {
  it('a mark 2 mm inside the trim on the right is "may be cut", with where it lies', () => {
    // On the scan (3 mm of bleed first): the trim's right edge is at 153 mm; the mark 150–151.5 mm, 40–60 mm down the page.
    const paint: Paint = (x, y) => (x >= 150 && x < 151.5 && y >= 43 && y < 63 ? 0 : panels(x, y));
    const c = rule(page(scanOf(156, 156, 300, paint), 'line', BLEED), 'cut-band');
    expect(c).toHaveLength(1);
    expect(c[0]!.level).toBe('warn');
    expect(c[0]!.message).toMatch(/^May be cut: ink within 5\.0 mm of the trim on the right \(as close as 1\.5 mm\), from [\d.]+ to [\d.]+ mm down/);
    // Where it lies, to within a grid cell (0.6 mm) and a sampling step (0.5 mm): 40 to 60 mm down the page.
    const [from, to] = c[0]!.message
      .match(/from ([\d.]+) to ([\d.]+) mm down/)!
      .slice(1)
      .map(Number);
    expect(Math.abs(from! - 40)).toBeLessThanOrEqual(1);
    expect(Math.abs(to! - 60)).toBeLessThanOrEqual(1);
  });
  it('a full-bleed background running off the page on purpose is not flagged', () => {
    const c = rule(
      page(
        scanOf(156, 156, 300, (x, y) => (y > 100 ? 60 : panels(x, y))),
        'grey',
        BLEED,
      ),
      'cut-band',
    );
    expect(c.map((x) => x.level)).toEqual(['ok']);
  });
});

describe('missing final pages and the book', () => {
  it('a gag without a final page fails; a blank page needs none', () => {
    const gag = pagePreflight(SPEC, { number: 4, entryId: 'e4', gagId: 'g4', kind: 'gag', final: null, analysis: null });
    expect(gag).toMatchObject({ level: 'fail', ppi: null, checks: [{ rule: 'missing', level: 'fail' }] });
    expect(gag.checks[0]!.message).toMatch(/newest pass stands in, marked "not final"/);
    expect(pagePreflight(SPEC, { number: 5, entryId: 'e5', kind: 'blank', final: null, analysis: null }).level).toBe('ok');
  });
  it('page count for the binding, blanks to add and where, the spine for perfect binding only, with the printer caution', () => {
    const kinds = ['cover', 'title', 'gag', 'gag', 'gag', 'gag', 'gag', 'gag', 'afterword'];
    const saddle = bookPreflight({ kinds, binding: 'saddle', caliperUm: 100, missing: [3, 4] });
    expect(saddle).toMatchObject({ pages: 9, binding: 'saddle', blanksToAdd: 3, blanksAfter: 8, level: 'fail' });
    expect(saddle.spineMm).toBeUndefined();
    expect(saddle.checks[0]!.message).toMatch(/adds 3 blank pages after page 8.*confirm with yours.*printer's own specification takes precedence/);
    expect(saddle.checks.at(-1)!.message).toMatch(/pages 3, 4/);
    const perfect = bookPreflight({ kinds: [...kinds, 'blank'], binding: 'perfect', caliperUm: 100, missing: [] });
    expect(perfect).toMatchObject({ pages: 10, blanksToAdd: 0, level: 'ok' });
    expect(perfect.spineMm).toBeCloseTo((10 / 2) * 0.1, 10); // pages ÷ 2 × caliper
    expect(perfect.checks.find((c) => c.rule === 'spine')!.message).toMatch(/Spine 0\.50 mm at 10 pages on 100 µm paper/);
  });
});
