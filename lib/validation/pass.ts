// Pass operations as the editor sends them. Shape checks here; the bleed-box
// check needs the series' page spec and runs in checkOpsInside.
import { z } from 'zod';
import { type PageSpec, bleedBox, panelRects, specProblems } from '@/lib/print/geometry';
import { MAX_POINTS_PER_STROKE, type Op, ROOM_SHAPES, ROTATIONS, TOOLS } from '@/lib/strokes/types';
import { oneLine } from './text';

export const clientId = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'Ids are 1–64 characters: letters, digits, "_" or "-".');

const panel = z.number().int().min(0, 'Panels are numbered 0 to 3.').max(3, 'Panels are numbered 0 to 3.');
const mm = z.number({ error: 'Coordinates must be numbers (mm).' });

export const pointSchema = z.tuple([mm, mm, z.number().min(0).max(1, 'Pressure runs from 0 to 1.')]);

export const strokeSchema = z.object({
  id: clientId,
  panel,
  tool: z.enum(TOOLS),
  grey: z.number().int().min(0).max(100),
  size: z.number().min(0.05, 'A stroke is at least 0.05 mm wide.').max(40, 'A stroke is at most 40 mm wide.'),
  points: z
    .array(pointSchema)
    .min(1, 'A stroke needs at least one point.')
    .max(MAX_POINTS_PER_STROKE, `A stroke may have at most ${MAX_POINTS_PER_STROKE.toLocaleString('en')} points.`),
});

export const roomSchema = z.object({
  id: clientId,
  panel,
  shape: z.enum(ROOM_SHAPES),
  x: mm,
  y: mm,
  w: z.number().positive('A balloon room needs a width.').max(400),
  h: z.number().positive('A balloon room needs a height.').max(400),
});

export const lightboxSchema = z.object({
  id: clientId,
  uploadId: oneLine('The upload id').min(1, 'Which upload? "uploadId" is missing.').max(64),
  panel: panel.nullable(),
  x: mm.min(-2000).max(2000),
  y: mm.min(-2000).max(2000),
  w: z.number().min(1, 'A lightbox is at least 1 mm wide.').max(2000, 'A lightbox is at most 2000 mm wide.'),
  h: z.number().min(1, 'A lightbox is at least 1 mm high.').max(2000, 'A lightbox is at most 2000 mm high.'),
  rotation: z.union(
    ROTATIONS.map((r) => z.literal(r)),
    { error: 'Rotation is 0, 90, 180 or 270 degrees.' },
  ),
  opacity: z.number().min(0.05, 'Opacity runs from 5% to 100%.').max(1, 'Opacity runs from 5% to 100%.'),
  visible: z.boolean(),
});

export const opSchema = z.discriminatedUnion('op', [
  z.object({ op: z.literal('add'), stroke: strokeSchema }),
  z.object({ op: z.literal('remove'), strokeId: clientId }),
  z.object({ op: z.literal('move'), strokeIds: z.array(clientId).min(1).max(20_000), dx: mm, dy: mm }),
  z.object({ op: z.literal('room'), room: roomSchema }),
  z.object({ op: z.literal('unroom'), roomId: clientId }),
  z.object({ op: z.literal('lightbox'), lightbox: lightboxSchema }),
  z.object({ op: z.literal('unlightbox'), lightboxId: clientId }),
]);

export const batchSchema = z.object({
  batchId: clientId,
  ops: z.array(opSchema).min(1, 'A batch holds at least one operation.').max(5000),
});

export const createPassSchema = z
  .object({ copyFrom: z.number().int().positive().max(1_000_000, 'There is no such pass to copy.').optional() })
  .strict();

export const pageSpecSchema = z
  .object({
    trimW: z.number().min(20).max(600),
    trimH: z.number().min(20).max(600),
    bleed: z.number().min(0).max(25),
    safe: z.number().min(0).max(60),
    gutter: z.number().min(0).max(60),
  })
  .strict()
  .superRefine((spec, ctx) => {
    for (const message of specProblems(spec)) ctx.addIssue({ code: 'custom', message });
  });

/** The first point or room outside the bleed box, as a sentence; null when all are inside. */
export function checkOpsInside(ops: Op[], spec: PageSpec): string | null {
  const b = bleedBox(spec);
  const inside = (x: number, y: number) => x >= b.x && x <= b.x + b.w && y >= b.y && y <= b.y + b.h;
  for (const op of ops) {
    if (op.op === 'add') {
      const bad = op.stroke.points.find(([x, y]) => !inside(x, y));
      if (bad) {
        return `Stroke ${op.stroke.id} has a point outside the bleed box (${bad[0]}, ${bad[1]} mm); the page runs from ${b.x} to ${b.x + b.w} mm.`;
      }
    }
    if (op.op === 'room') {
      const r = op.room;
      if (!inside(r.x, r.y) || !inside(r.x + r.w, r.y + r.h)) {
        return `Balloon room ${r.id} reaches outside the bleed box.`;
      }
    }
    if (op.op === 'lightbox') {
      // It may hang over the edges (it is clipped), but must show somewhere.
      const l = op.lightbox;
      const area = l.panel === null ? b : panelRects(spec)[l.panel]!;
      if (l.x >= area.x + area.w || l.y >= area.y + area.h || l.x + l.w <= area.x || l.y + l.h <= area.y) {
        return `Lightbox ${l.id} lies wholly outside ${l.panel === null ? 'the page' : `panel ${l.panel + 1}`}.`;
      }
    }
  }
  return null;
}
