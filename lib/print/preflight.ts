// The preflight of a page and of a book (pure): resolution at the fitted size, colour in a
// greyscale book, art covering the bleed, ink in the band between trim and safe area, a
// missing final page; the page count for the binding, blanks to add, the spine. Lengths
// in mm from the trim's top left; the scan's pixels are read through its analysis grid
// (scan-analysis.ts) at the page points the fit puts them.
import { type Binding, blankSuggestion, blanksNeeded, bookSpineMm, pageCountValid } from './book';
import { type Fit, type Placed, type ScanColour, pageToScan, placedBox, placedPpi, scanToPage } from './final-fit';
import { type PageSpec, bleedBox, safeBox } from './geometry';
import { type Check, type Level, PRINTER_FIRST, SOURCES, resolutionCheck } from './preflight-rules';
import { type ScanAnalysis, shareAt } from './scan-analysis';

export type PreflightScan = { id: string; width: number; height: number; colour: ScanColour; fit: Fit };
export type PageInput = { number: number; entryId: string; gagId?: string; kind: string; final: PreflightScan | null; analysis: ScanAnalysis | null };
export type PagePreflight = {
  number: number;
  entryId: string;
  gagId?: string;
  finalPageId?: string;
  kind: string;
  ppi: { x: number; y: number } | null;
  level: Level;
  checks: Check[];
};

/** Page points are sampled this far apart (mm): finer than any cut worth naming. */
const STEP = 0.5;
/** A grid cell counts as inked from this share of ink pixels: a hairline in a 0.6 mm cell passes it. */
const INKED = 0.15;
/**
 * Ink counts as in the cut band from this far past the safe line: a panel border drawn on the
 * safe line (the grid fills the safe area) straddles it by half its width, and a grid cell is 0.6 mm.
 */
const ON_THE_LINE = 0.75;
/** Ink in the cut band that continues over this share of the way to the bleed edge runs off the page on purpose. */
const RUNS_OFF = 0.8;

const mm1 = (n: number) => (Math.round(n * 10) / 10).toFixed(1);
export const worst = (checks: Check[]): Level =>
  checks.some((c) => c.level === 'fail') ? 'fail' : checks.some((c) => c.level === 'warn') ? 'warn' : 'ok';

type Side = 'left' | 'right' | 'top' | 'bottom';
const SIDES: Side[] = ['left', 'right', 'top', 'bottom'];

function sampler(placed: Placed, scan: PreflightScan, analysis: ScanAnalysis | null) {
  return (which: 'ink' | 'colour', x: number, y: number) => {
    if (!analysis) return 0;
    const at = pageToScan(placed, scan, x, y);
    return at ? shareAt(analysis, which, at.px, at.py) : 0;
  };
}

function bleedChecks(spec: PageSpec, placed: Placed, inkAt: (x: number, y: number) => number): Check[] {
  const b = bleedBox(spec);
  const gap: Record<Side, number> = {
    left: placed.x - b.x,
    top: placed.y - b.y,
    right: b.x + b.w - (placed.x + placed.w),
    bottom: b.y + b.h - (placed.y + placed.h),
  };
  const out: Check[] = [];
  for (const side of SIDES) {
    if (gap[side] <= 0.05) continue;
    // Does the art reach the scan's edge on that side? Sample just inside the placed box along it.
    const along = side === 'left' || side === 'right' ? placed.h : placed.w;
    let inked = 0;
    for (let t = STEP / 2; t < along; t += STEP) {
      const x = side === 'left' ? placed.x + 0.25 : side === 'right' ? placed.x + placed.w - 0.25 : placed.x + t;
      const y = side === 'top' ? placed.y + 0.25 : side === 'bottom' ? placed.y + placed.h - 0.25 : placed.y + t;
      if (inkAt(x, y) >= INKED) inked++;
    }
    const where =
      gap[side] >= spec.bleed - 0.05
        ? gap[side] <= spec.bleed + 0.05
          ? ' (it stops at the trim)'
          : ` (it stops ${mm1(gap[side] - spec.bleed)} mm inside the trim)`
        : '';
    out.push({
      rule: 'bleed',
      level: inked > 0 ? 'fail' : 'warn',
      message:
        `The art stops ${mm1(gap[side])} mm short of the bleed edge on the ${side}${where}.` +
        (inked > 0
          ? ' Its edge there has ink, so a white sliver may show after trimming: extend the art or refit to the bleed.'
          : ' Its edge there is blank paper, so the gap prints white like the margin.'),
      source: SOURCES.bleed,
    });
  }
  return out.length ? out : [{ rule: 'bleed', level: 'ok', message: 'The art covers the whole bleed box.', source: SOURCES.bleed }];
}

/** Ink in the band between the trim and the safe area, side by side, unless it runs off the page on purpose. */
function cutBandChecks(spec: PageSpec, inkAt: (x: number, y: number) => number): Check[] {
  const safe = safeBox(spec);
  const out: Check[] = [];
  if (spec.safe <= 0) return [];
  for (const side of SIDES) {
    const horizontal = side === 'left' || side === 'right';
    const length = horizontal ? spec.trimH : spec.trimW;
    let from = Infinity;
    let to = -Infinity;
    let closest = Infinity; // how near the trim the flagged ink comes
    for (let t = STEP / 2; t < length; t += STEP) {
      // Points across the band, from the trim inward (d = distance from the trim), and out into the bleed (d < 0).
      const at = (d: number): [number, number] =>
        side === 'left' ? [d, t] : side === 'right' ? [spec.trimW - d, t] : side === 'top' ? [t, d] : [t, spec.trimH - d];
      let nearest = Infinity;
      for (let d = STEP / 2; d < spec.safe - ON_THE_LINE; d += STEP) {
        if (inkAt(...at(d)) >= INKED) {
          nearest = d;
          break;
        }
      }
      if (nearest === Infinity) continue;
      let outside = 0;
      let n = 0;
      for (let d = -STEP / 2; d > -spec.bleed; d -= STEP, n++) if (inkAt(...at(d)) >= INKED) outside++;
      if (n > 0 && outside / n >= RUNS_OFF) continue; // a background running off the page: meant to be cut
      from = Math.min(from, t);
      to = Math.max(to, t);
      closest = Math.min(closest, nearest);
    }
    if (from === Infinity) continue;
    const span = horizontal
      ? `from ${mm1(from - STEP / 2)} to ${mm1(to + STEP / 2)} mm down`
      : `from ${mm1(from - STEP / 2)} to ${mm1(to + STEP / 2)} mm across`;
    out.push({
      rule: 'cut-band',
      level: 'warn',
      message: `May be cut: ink within ${mm1(spec.safe)} mm of the trim on the ${side} (as close as ${mm1(Math.max(0, closest - STEP / 2))} mm), ${span}. Keep what matters inside the safe area (${mm1(safe.w)} × ${mm1(safe.h)} mm).`,
      source: SOURCES.cutBand,
    });
  }
  return out.length
    ? out
    : [
        {
          rule: 'cut-band',
          level: 'ok',
          message: 'Nothing but art that runs off the page lies between the trim and the safe area.',
          source: SOURCES.cutBand,
        },
      ];
}

function colourCheck(scan: PreflightScan, placed: Placed, analysis: ScanAnalysis | null): Check | null {
  if (scan.colour !== 'rgb') return null;
  if (!analysis || analysis.colourPixels === 0) {
    return { rule: 'colour', level: 'ok', message: 'A colour file with no colour in it: it prints as grey unchanged.', source: SOURCES.colour };
  }
  const share = analysis.colourPixels / (analysis.width * analysis.height);
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (let r = 0; r < analysis.rows; r++) {
    for (let c = 0; c < analysis.cols; c++) {
      if (analysis.colour[r * analysis.cols + c] === 0) continue;
      for (const [px, py] of [
        [c * analysis.cell, r * analysis.cell],
        [Math.min(analysis.width, (c + 1) * analysis.cell), Math.min(analysis.height, (r + 1) * analysis.cell)],
      ] as const) {
        const p = scanToPage(placed, scan, px, py);
        x0 = Math.min(x0, p.x);
        y0 = Math.min(y0, p.y);
        x1 = Math.max(x1, p.x);
        y1 = Math.max(y1, p.y);
      }
    }
  }
  const pct = share * 100 < 0.1 ? (share * 100).toFixed(3) : (share * 100).toFixed(1);
  return {
    rule: 'colour',
    level: 'warn',
    message: `${pct} % of the scan's pixels are in colour, within ${mm1(x0)}–${mm1(x1)} mm across and ${mm1(y0)}–${mm1(y1)} mm down the page. The book is greyscale: the print file converts them to grey.`,
    source: SOURCES.colour,
  };
}

/** Every check of one page. Without a final page: missing (a blank page needs none). */
export function pagePreflight(spec: PageSpec, page: PageInput): PagePreflight {
  const base = { number: page.number, entryId: page.entryId, ...(page.gagId ? { gagId: page.gagId } : {}), kind: page.kind };
  if (!page.final) {
    const checks: Check[] =
      page.kind === 'blank'
        ? [{ rule: 'missing', level: 'ok', message: 'A blank page: nothing to print.', source: SOURCES.missing }]
        : [
            {
              rule: 'missing',
              level: 'fail',
              message:
                page.kind === 'gag'
                  ? 'No final page yet. In a proof its newest pass stands in, marked "not final"; the print file waits for the scan.'
                  : 'No final page yet for this matter page. In a proof it stands as a labelled placeholder; the print file waits for it.',
              source: SOURCES.missing,
            },
          ];
    return { ...base, ppi: null, level: worst(checks), checks };
  }
  const scan = page.final;
  const placed = placedBox(spec, scan.fit, scan);
  const ppi = placedPpi(placed, scan);
  const sample = sampler(placed, scan, page.analysis);
  const inkAt = (x: number, y: number) => sample('ink', x, y);
  const colour = colourCheck(scan, placed, page.analysis);
  const checks = [resolutionCheck(ppi, scan.colour), ...(colour ? [colour] : []), ...bleedChecks(spec, placed, inkAt), ...cutBandChecks(spec, inkAt)];
  return { ...base, finalPageId: scan.id, ppi, level: worst(checks), checks };
}

export type BookPreflight = {
  pages: number;
  binding: Binding;
  blanksToAdd: number;
  blanksAfter: number;
  spineMm?: number;
  level: Level;
  checks: Check[];
};

/** The book: page count for the binding, the blanks the print file adds, the spine, and what is still missing. */
export function bookPreflight(input: { kinds: string[]; binding: Binding; caliperUm: number; missing: number[] }): BookPreflight {
  const pages = input.kinds.length;
  const blanks = blanksNeeded(pages, input.binding);
  const after = blankSuggestion(input.kinds);
  const rule = input.binding === 'saddle' ? 'a multiple of 4' : 'an even count';
  const checks: Check[] = [];
  if (pages === 0) checks.push({ rule: 'page-count', level: 'fail', message: 'The running order is empty.', source: SOURCES.pageCount });
  else if (pageCountValid(pages, input.binding)) {
    checks.push({
      rule: 'page-count',
      level: 'ok',
      message: `${pages} pages: ${rule}, as ${input.binding === 'saddle' ? 'saddle stitching' : 'perfect binding'} needs. ${PRINTER_FIRST}`,
      source: SOURCES.pageCount,
    });
  } else {
    checks.push({
      rule: 'page-count',
      level: 'warn',
      message: `${pages} pages cannot be ${input.binding === 'saddle' ? 'saddle stitched' : 'perfect bound'} (it takes ${rule}): the print file adds ${blanks} blank page${blanks === 1 ? '' : 's'} after page ${after}, or add pages of your own. Printers differ: confirm with yours. ${PRINTER_FIRST}`,
      source: SOURCES.pageCount,
    });
  }
  const spine = bookSpineMm(pages + blanks, input.binding, input.caliperUm);
  if (spine !== null) {
    checks.push({
      rule: 'spine',
      level: 'ok',
      message: `Spine ${spine.toFixed(2)} mm at ${pages + blanks} pages on ${input.caliperUm} µm paper. Confirm the width with your printer before the cover is final. ${PRINTER_FIRST}`,
      source: SOURCES.spine,
    });
  }
  if (input.missing.length) {
    checks.push({
      rule: 'missing',
      level: 'fail',
      message: `No final page yet on page${input.missing.length === 1 ? '' : 's'} ${input.missing.join(', ')}: the print file waits for ${input.missing.length === 1 ? 'it' : 'them'} (a proof can be made now).`,
      source: SOURCES.missing,
    });
  }
  return {
    pages,
    binding: input.binding,
    blanksToAdd: blanks,
    blanksAfter: after,
    ...(spine !== null ? { spineMm: spine } : {}),
    level: worst(checks),
    checks,
  };
}
