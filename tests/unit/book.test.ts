import { describe, expect, it } from 'vitest';
import {
  BLEED_PRESETS,
  TRIM_PRESETS,
  blankSuggestion,
  bookSpineMm,
  blanksNeeded,
  inToMm,
  mmToIn,
  pageCountValid,
  pdfBoxes,
  pixelsAt,
  printerSpreads,
  readerSpreads,
  sheetsNeeded,
  spineMm,
} from '@/lib/print/book';
import { mmToPt } from '@/lib/print/geometry';
import { DEFAULT_HOURS, plan } from '@/lib/planning/plan';

describe('units', () => {
  // 1 in = 25.4 mm exactly (the 1959 international yard and pound agreement).
  it('inches', () => {
    expect(inToMm(6)).toBeCloseTo(152.4, 10);
    expect(mmToIn(25.4)).toBe(1);
  });
  // PDF user space unit: 1/72 in (PDF Reference 1.7 §4.2; ISO 32000-1).
  it('points', () => {
    expect(mmToPt(25.4)).toBeCloseTo(72, 10);
    expect(mmToPt(210)).toBeCloseTo(595.28, 2); // ISO 216 A4 width 210 mm
    expect(mmToPt(297)).toBeCloseTo(841.89, 2); // ISO 216 A4 height 297 mm
  });
  it('pixels at 300 and 600 ppi', () => {
    expect(pixelsAt(150, 300)).toBe(1772); // 150 / 25.4 × 300 = 1771.65 → 1772 px
    expect(pixelsAt(150, 600)).toBe(3544);
    expect(pixelsAt(25.4, 300)).toBe(300);
  });
  it('presets', () => {
    expect(TRIM_PRESETS.a5).toMatchObject({ trimW: 148, trimH: 210 }); // ISO 216 A5
    expect(TRIM_PRESETS.square6in.trimW).toBeCloseTo(152.4, 10);
    expect(BLEED_PRESETS.mm3).toBe(3); // UK and Europe, common practice
    expect(BLEED_PRESETS.in8).toBeCloseTo(3.175, 10); // 1/8 in, US, common practice
  });
});

describe('page boxes', () => {
  it('MediaBox = BleedBox = trim plus bleed; TrimBox inset by the bleed (pt)', () => {
    const b = pdfBoxes({ trimW: 150, trimH: 150, bleed: 3, safe: 5, gutter: 4 });
    const w = (156 / 25.4) * 72; // 442.205 pt
    expect(b.media[2]).toBeCloseTo(w, 6);
    expect(b.bleed).toEqual(b.media);
    expect(b.trim[0]).toBeCloseTo((3 / 25.4) * 72, 6);
    expect(b.trim[2] - b.trim[0]).toBeCloseTo((150 / 25.4) * 72, 6);
  });
});

describe('page counts', () => {
  it('saddle stitch needs a multiple of 4 (common practice); perfect binding an even count', () => {
    expect(pageCountValid(24, 'saddle')).toBe(true);
    expect(pageCountValid(26, 'saddle')).toBe(false);
    expect(pageCountValid(26, 'perfect')).toBe(true);
    expect(pageCountValid(27, 'perfect')).toBe(false);
    expect(blanksNeeded(26, 'saddle')).toBe(2);
    expect(blanksNeeded(25, 'saddle')).toBe(3);
    expect(blanksNeeded(24, 'saddle')).toBe(0);
    expect(blanksNeeded(27, 'perfect')).toBe(1);
  });
  it('suggests the blanks after the last gag, before the back matter', () => {
    expect(blankSuggestion(['cover', 'title', 'gag', 'gag', 'afterword', 'credits'])).toBe(4);
    expect(blankSuggestion(['gag', 'gag'])).toBe(2);
  });
  it('spine = pages ÷ 2 × caliper (printer guides, common practice); sheets', () => {
    expect(spineMm(120, 100)).toBeCloseTo(6, 10);
    expect(spineMm(24, 130)).toBeCloseTo(1.56, 10);
    expect(bookSpineMm(24, 'perfect', 130)).toBeCloseTo(1.56, 10);
    expect(bookSpineMm(24, 'saddle', 130)).toBeNull(); // folded and stapled: no spine
    expect(sheetsNeeded(24, 'saddle')).toBe(6);
    expect(sheetsNeeded(26, 'perfect')).toBe(13);
  });
});

describe('spreads', () => {
  it('reader spreads: page 1 alone on the right; mirrored right to left', () => {
    expect(readerSpreads(6)).toEqual([
      [null, 1],
      [2, 3],
      [4, 5],
      [6, null],
    ]);
    expect(readerSpreads(5, 'rtl')).toEqual([
      [1, null],
      [3, 2],
      [5, 4],
    ]);
  });
  it('printer spreads for saddle stitch: pairs summing to n + 1, outer and inner alternating', () => {
    expect(printerSpreads(8)).toEqual([
      [8, 1],
      [2, 7],
      [6, 3],
      [4, 5],
    ]);
    for (const [l, r] of printerSpreads(24)) expect(l! + r!).toBe(25);
    expect(printerSpreads(10)).toEqual([]);
    expect(printerSpreads(0)).toEqual([]);
  });
  it('right to left: the same pairs, sides swapped (page 1 on the left half of the outer sheet)', () => {
    expect(printerSpreads(8, 'rtl')).toEqual([
      [1, 8],
      [7, 2],
      [3, 6],
      [5, 4],
    ]);
  });
});

describe('planner', () => {
  it('hours left per stage, the finish date and the margin', () => {
    const gags = [{ status: 'idea' as const }, { status: 'ready_to_ink' as const }, { status: 'inked' as const }, { status: 'placed' as const }];
    const p = plan({
      pages: gags,
      hoursPerPage: DEFAULT_HOURS,
      hoursPerWeek: 2,
      today: new Date('2027-01-04T00:00:00Z'),
      deadline: new Date('2027-03-13T00:00:00Z'),
    });
    // idea: 0.5 + 1.5 + 0.25; ready: 1.5 + 0.25; inked: 0.25 → 4.25 h
    expect(p.hoursByStage).toEqual({ thumbnails: 0.5, finish: 3, scan: 0.75 });
    expect(p.hoursLeft).toBeCloseTo(4.25, 10);
    expect(p.weeksNeeded).toBeCloseTo(2.125, 10);
    expect(p.finish).toBe('2027-01-19'); // ceil(2.125 × 7) = 15 days after 4 January
    expect(p.marginDays).toBe(53);
    expect(p.late).toBe(false);
    expect(p.burndown[0]!.pagesLeft).toBe(3);
    expect(p.burndown.at(-1)!.pagesLeft).toBe(0);
  });
  it('counts the cover and other matter pages as pages to make, until marked done; blank pages need no hours', () => {
    const base = {
      hoursPerPage: DEFAULT_HOURS,
      hoursPerWeek: 2,
      today: new Date('2027-01-04T00:00:00Z'),
      deadline: new Date('2027-03-13T00:00:00Z'),
    };
    const p = plan({
      ...base,
      pages: [
        { matter: 'cover', done: false },
        { matter: 'title', done: false },
        { status: 'inked' },
        { matter: 'blank', done: false },
        { matter: 'afterword', done: true },
      ],
    });
    // cover and title page: 2 × (0.5 + 1.5 + 0.25) = 4.5 h; inked: 0.25 h; blank and done afterword: 0
    expect(p.hoursByStage).toEqual({ thumbnails: 1, finish: 3, scan: 0.75 });
    expect(p.hoursLeft).toBeCloseTo(4.75, 10);
    expect(p.burndown[0]!.pagesLeft).toBe(3);
    expect(plan({ ...base, pages: [{ matter: 'cover', done: true }] }).hoursLeft).toBe(0);
  });
  it('warns when the plan is late', () => {
    const gags = Array.from({ length: 40 }, () => ({ status: 'idea' as const }));
    const p = plan({
      pages: gags,
      hoursPerPage: DEFAULT_HOURS,
      hoursPerWeek: 3,
      today: new Date('2027-02-01T00:00:00Z'),
      deadline: new Date('2027-03-13T00:00:00Z'),
    });
    expect(p.late).toBe(true);
    expect(p.marginDays).toBeLessThan(0);
  });
});

describe('a small square comic of about 147 mm trim (common practice)', () => {
  it('needs 1,737 px a side at 300 ppi and 3,473 at 600 ppi', () => {
    // 147 / 25.4 × 300 = 1736.22 → 1737; × 600 = 3472.44 → 3473
    expect(pixelsAt(147, 300)).toBe(1737);
    expect(pixelsAt(147, 600)).toBe(3473);
  });
});
