// The blue-line export's query string (`…/export/templates.pdf?scale=&paper=&…`).
import { z } from 'zod';
import { GUIDE_NAMES, GUIDE_STRENGTH, PAPER_NAMES, SHEET_SCALES } from '@/lib/print/sheets';

const word = <T extends string>(allowed: readonly T[], message: string) => z.enum(allowed as [T, ...T[]], { error: message });

export const sheetsQuery = z.object({
  scale: word(
    SHEET_SCALES.map((n) => String(n) as `${typeof n}`),
    `"scale" is ${SHEET_SCALES.slice(0, -1).join(', ')} or ${SHEET_SCALES.at(-1)} (percent).`,
  )
    .default('100')
    .transform(Number),
  paper: word(PAPER_NAMES, `"paper" is ${PAPER_NAMES.join(' or ')}.`).default('A4'),
  /** 1: a page too big for the paper is cut across several sheets with overlap marks. */
  tile: word(['0', '1'], '"tile" is 1 (cut a page too big for the paper across sheets) or 0.')
    .default('0')
    .transform((v) => v === '1'),
  guide: word(GUIDE_NAMES, `"guide" is ${GUIDE_NAMES.join(' or ')}.`).default('blue'),
  strength: z
    .string()
    .default(String(GUIDE_STRENGTH.default))
    .transform(Number)
    .refine(
      (n) => Number.isInteger(n) && n >= GUIDE_STRENGTH.min && n <= GUIDE_STRENGTH.max,
      `"strength" is a whole percent from ${GUIDE_STRENGTH.min} to ${GUIDE_STRENGTH.max}.`,
    ),
  /** Gag ids, comma-separated; left out: the gags ready to ink; empty: one blank template. */
  gags: z
    .string()
    .max(20_000, 'Too many gags listed.')
    .regex(/^[A-Za-z0-9_,-]*$/, '"gags" is a comma-separated list of gag ids.')
    .transform((s) => [...new Set(s.split(',').filter(Boolean))])
    .optional(),
});

export type SheetsQuery = z.infer<typeof sheetsQuery>;
