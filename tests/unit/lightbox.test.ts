// The lightbox's arithmetic and its place in the pass model.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { UndoStack, lightboxChanged, lightboxRemoved } from '@/components/editor/undo';
import { DEFAULT_PAGE_SPEC, panelRects } from '@/lib/print/geometry';
import { PPI_GREYSCALE, PPI_LINE_ART, effectivePpi, lightboxPpi, printCheck } from '@/lib/print/ppi';
import { centreAt, fitInto, scaleTo, turnQuarter, unrotatedSize } from '@/lib/strokes/lightbox';
import { applyDelta, applyOp, docFrom, emptyDoc } from '@/lib/strokes/pass-model';
import type { Lightbox, Op } from '@/lib/strokes/types';

const lb = (patch: Partial<Lightbox> = {}): Lightbox => ({
  id: 'l1',
  uploadId: 'u1',
  panel: 1,
  x: 80,
  y: 10,
  w: 60,
  h: 40,
  rotation: 0,
  opacity: 0.5,
  visible: true,
  ...patch,
});

describe('print check (ppi)', () => {
  it('1771 px filling a 150 mm trim is 1771 / (150 / 25.4) ≈ 300 ppi (1 in = 25.4 mm exactly)', () => {
    // Worked by hand: 150 / 25.4 = 5.9055 in; 1771 / 5.9055 = 299.89.
    expect(effectivePpi(1771, 150)).toBeCloseTo(299.89, 2);
    expect(printCheck(effectivePpi(1771, 150)).level).toBe('greyscale'); // shown as 300
  });

  it('targets are 300 ppi for greyscale and 600 for line art (common practice)', () => {
    expect([PPI_GREYSCALE, PPI_LINE_ART]).toEqual([300, 600]);
    expect(printCheck(600).level).toBe('line-art');
    expect(printCheck(599.4).level).toBe('greyscale');
    expect(printCheck(299.4).level).toBe('low');
    expect(printCheck(150).message).toMatch(/^Only 150 ppi at print size: too soft to print/);
  });

  it('takes the lower axis, and a quarter turn lays the image height along the box width', () => {
    // 2000 × 1000 px in a 100 × 50 mm box: 2000 / (100 / 25.4) = 508 ppi on both axes.
    expect(lightboxPpi({ w: 100, h: 50, rotation: 0 }, { width: 2000, height: 1000 })).toBeCloseTo(508, 6);
    // Turned, the same box holds it as 1000 px across 100 mm = 254 ppi, and 2000 px down 50 mm = 1016 ppi: the lower wins.
    expect(lightboxPpi({ w: 100, h: 50, rotation: 90 }, { width: 2000, height: 1000 })).toBeCloseTo(254, 6);
    expect(lightboxPpi({ w: 50, h: 100, rotation: 270 }, { width: 2000, height: 1000 })).toBeCloseTo(508, 6);
  });
});

describe('lightbox geometry', () => {
  const panel = panelRects(DEFAULT_PAGE_SPEC)[1]!;

  it('fits an image into a panel, centred, keeping its proportions', () => {
    const f = fitInto(panel, { width: 3000, height: 1500 }, 0);
    expect(f.w).toBeCloseTo(panel.w, 2);
    expect(f.h).toBeCloseTo(panel.w / 2, 2);
    expect(f.x).toBeCloseTo(panel.x, 2);
    expect(f.y + f.h / 2).toBeCloseTo(panel.y + panel.h / 2, 2);
    const t = fitInto(panel, { width: 3000, height: 1500 }, 90); // turned: tall
    expect(t.h / t.w).toBeCloseTo(2, 1);
    expect(t.h).toBeLessThanOrEqual(panel.h + 0.01);
  });

  it('four quarter turns come back to the start, each keeping the centre and swapping the sides', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 200, noNaN: true }),
        fc.double({ min: 1, max: 150, noNaN: true }),
        fc.double({ min: 1, max: 150, noNaN: true }),
        (x, y, w, h) => {
          const start = lb({
            x: Math.round(x * 100) / 100,
            y: Math.round(y * 100) / 100,
            w: Math.round(w * 100) / 100,
            h: Math.round(h * 100) / 100,
          });
          const once = turnQuarter(start);
          expect(once.rotation).toBe(90);
          expect([once.w, once.h]).toEqual([start.h, start.w]);
          expect(once.x + once.w / 2).toBeCloseTo(start.x + start.w / 2, 1);
          expect(once.y + once.h / 2).toBeCloseTo(start.y + start.h / 2, 1);
          expect(unrotatedSize(once)).toEqual({ w: start.w, h: start.h });
          const back = turnQuarter(turnQuarter(turnQuarter(once)));
          expect(back.rotation).toBe(0);
          expect(Math.abs(back.x - start.x)).toBeLessThan(0.05);
          expect(Math.abs(back.y - start.y)).toBeLessThan(0.05);
        },
      ),
    );
  });

  it('scales about the centre and keeps proportions; moves by its centre', () => {
    const s = scaleTo(lb(), 120);
    expect([s.w, s.h]).toEqual([120, 80]);
    expect([s.x + s.w / 2, s.y + s.h / 2]).toEqual([110, 30]);
    expect(centreAt(lb(), 50, 50)).toMatchObject({ x: 20, y: 30, w: 60, h: 40 });
  });
});

describe('lightboxes in the pass model', () => {
  it('placing, changing and taking away; a late placement of a taken-away id is ignored', () => {
    const doc = emptyDoc();
    const touched = applyOp(doc, { op: 'lightbox', lightbox: lb() });
    expect(touched.size).toBe(0); // no panel bitmap redraws: it is not ink
    applyOp(doc, { op: 'lightbox', lightbox: lb({ opacity: 0.4 }) });
    expect(doc.lightboxes.get('l1')!.opacity).toBe(0.4);
    expect(doc.strokes.size).toBe(0);
    applyOp(doc, { op: 'unlightbox', lightboxId: 'l1' });
    applyOp(doc, { op: 'lightbox', lightbox: lb() });
    expect(doc.lightboxes.size).toBe(0);
  });

  it("a server delta wins, then this person's unsent change of the same lightbox is applied again", () => {
    const doc = docFrom([], [], [lb()]);
    const mine: Op = { op: 'lightbox', lightbox: lb({ opacity: 0.4 }) };
    applyOp(doc, mine);
    applyDelta(doc, { strokes: [], removedStrokes: [], rooms: [], removedRooms: [], lightboxes: [lb({ x: 90 })], removedLightboxes: [] }, [mine]);
    expect(doc.lightboxes.get('l1')).toMatchObject({ opacity: 0.4 });
    applyDelta(doc, { strokes: [], removedStrokes: [], rooms: [], removedRooms: [], lightboxes: [], removedLightboxes: ['l1'] }, []);
    expect(doc.lightboxes.size).toBe(0);
  });

  it('undo of a placement takes it away; redo places a copy under a new id; undo of a change restores the old value', () => {
    const stack = new UndoStack();
    stack.push(lightboxChanged(null, lb()));
    expect(stack.undo()).toEqual([{ op: 'unlightbox', lightboxId: 'l1' }]);
    const redo = stack.redo()!;
    expect(redo[0]).toMatchObject({ op: 'lightbox', lightbox: { uploadId: 'u1', x: 80 } });
    expect((redo[0] as { lightbox: Lightbox }).lightbox.id).not.toBe('l1');

    const changed = lightboxChanged(lb(), lb({ rotation: 90 }));
    expect(changed.undo()).toEqual([{ op: 'lightbox', lightbox: lb() }]);
    const removed = lightboxRemoved(lb());
    expect(removed.redo()).toEqual([{ op: 'unlightbox', lightboxId: 'l1' }]);
  });
});
