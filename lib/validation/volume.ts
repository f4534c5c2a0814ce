import { z } from 'zod';
import { STAGES } from '@/lib/planning/plan';
import { specProblems } from '@/lib/print/geometry';
import { MATTER_KINDS } from '@/lib/print/matter';
import { oneLine } from './text';

const entryId = (what: string) => oneLine(what).min(1).max(64);

const date = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Dates are YYYY-MM-DD.')
  // Date.parse rolls 2027-02-30 over to 2 March; a real date reads back as itself.
  .refine((d) => {
    const t = Date.parse(`${d}T00:00:00Z`);
    return !Number.isNaN(t) && new Date(t).toISOString().slice(0, 10) === d;
  }, 'Not a real calendar date.');

export const volumeSpecPatch = z
  .object({
    trimW: z.number().min(50).max(600),
    trimH: z.number().min(50).max(600),
    bleed: z.number().min(0).max(25),
    safe: z.number().min(0).max(60),
    gutter: z.number().min(0).max(60),
    binding: z.enum(['saddle', 'perfect']),
    caliperUm: z.number().min(20).max(1000),
    direction: z.enum(['ltr', 'rtl']),
  })
  .partial()
  .strict();

export const createVolumeSchema = z
  .object({
    title: oneLine('The title').min(1, 'Give the volume a title.').max(120),
    deadline: date,
    hoursPerWeek: z.number().min(0.5).max(100).optional(),
    spec: volumeSpecPatch.optional(),
  })
  .strict();

export const updateVolumeSchema = z
  .object({
    title: oneLine('The title').min(1, 'Give the volume a title.').max(120).optional(),
    deadline: date.optional(),
    hoursPerWeek: z.number().min(0.5).max(100).optional(),
    spec: volumeSpecPatch.optional(),
    hoursPerPage: z
      .object(Object.fromEntries(STAGES.map((s) => [s, z.number().min(0).max(40)])) as Record<(typeof STAGES)[number], z.ZodNumber>)
      .partial()
      .strict()
      .optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Send at least one field.');

export const addEntrySchema = z.union([z.object({ gagId: entryId('The gag id') }).strict(), z.object({ kind: z.enum(MATTER_KINDS) }).strict()]);

/** A matter page marked done (the planner stops counting its hours) or not. */
export const entryDoneSchema = z.object({ done: z.boolean() }).strict();

export const moveEntrySchema = z
  .object({ before: entryId('The entry id').optional(), after: entryId('The entry id').optional() })
  .strict()
  .refine((v) => (v.before ? 1 : 0) + (v.after ? 1 : 0) === 1, 'Give exactly one of "before" or "after".');

/** A whole spec after a patch must still leave room for panels. */
export function specIssues(spec: { trimW: number; trimH: number; bleed: number; safe: number; gutter: number }) {
  return specProblems(spec);
}

/** POST /api/volumes/:volumeId/print-jobs: which file, and whether a proof (passes standing in for missing scans). */
export const printJobSchema = z
  .object({
    kind: z.enum(['print', 'cover'], { error: '"kind" is "print" (the pages) or "cover" (front, spine and back of a perfect-bound book).' }),
    proof: z.boolean({ error: '"proof" is true or false.' }).optional(),
  })
  .strict();
