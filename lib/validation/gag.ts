// Gag and beat input, shared by the forms (zodResolver) and the route handlers.
import { z } from 'zod';
import { BEAT_KINDS, GAG_STATUSES } from '@/lib/gags/status';
import { longText, oneLine } from './text';

export const gagTitle = oneLine('The title').min(1, 'Give the gag a title.').max(120, 'Keep the title under 120 characters.');

export const gagPremise = oneLine('The premise').max(280, 'The premise is one line: keep it under 280 characters.');

// Not trimmed: beat notes autosave while someone types.
export const beatNote = longText('A beat note', { trim: false }).max(2000, 'Keep a beat note under 2,000 characters.');

export const createGagSchema = z.object({
  title: gagTitle,
  premise: gagPremise.optional().default(''),
});
export type CreateGagInput = z.input<typeof createGagSchema>;

export const beatPatchSchema = z.object({
  kind: z.enum(BEAT_KINDS),
  note: beatNote,
});

export const updateGagSchema = z
  .object({
    title: gagTitle.optional(),
    premise: gagPremise.optional(),
    status: z.enum(GAG_STATUSES).optional(),
    beats: z
      .array(beatPatchSchema)
      .max(4)
      .refine((b) => new Set(b.map((x) => x.kind)).size === b.length, 'Each beat kind may appear once.')
      .optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Send at least one of title, premise, status, beats.');
export type UpdateGagInput = z.infer<typeof updateGagSchema>;
