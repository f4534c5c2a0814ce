// A final page's fit as a person sends it (PUT /api/final-pages/:id/fit), in mm and
// quarter turns; see lib/print/final-fit.ts for what each number means.
import { z } from 'zod';

const offset = z
  .number({ error: 'x and y are numbers (mm).' })
  .min(-600, 'An offset is at most 600 mm either way.')
  .max(600, 'An offset is at most 600 mm either way.');

export const fitSchema = z
  .object({
    to: z.enum(['trim', 'bleed'], { error: '"to" is "trim" or "bleed".' }),
    x: offset,
    y: offset,
    scale: z
      .number({ error: 'scale is a number (1 covers the box).' })
      .min(0.1, 'scale is at least 0.1 (a tenth of the size that covers the box).')
      .max(10, 'scale is at most 10.'),
    rotation: z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)], { error: 'rotation is 0, 90, 180 or 270 (clockwise).' }),
  })
  .strict();

export type FitInput = z.infer<typeof fitSchema>;
