// Review-loop input: stamps, checklist ticks and items, comments.
import { z } from 'zod';
import { BEAT_KINDS } from '@/lib/gags/status';
import { COMMENT_TARGETS, STAMP_DECISIONS } from '@/lib/review/words';
import { longText, oneLine } from './text';

const id = (what: string) => oneLine(what).min(1).max(64);

export const stampSchema = z
  .object({
    decision: z.enum(STAMP_DECISIONS, { error: 'The decision is "ready" or "again".' }),
    note: longText('The note').max(1000, 'Keep the note under 1,000 characters.').default(''),
  })
  .strict();

export const checklistPutSchema = z
  .object({
    /** Items ticked on this pass; anything not listed is unticked. */
    ticked: z.array(id('A checklist item id')).max(100),
    /** Items that keep their "to re-check" mark; absent: every mark stays except on items now ticked. */
    recheck: z.array(id('A checklist item id')).max(100).optional(),
  })
  .strict();

export const checklistCarrySchema = z
  .object({
    /** The number of the pass whose ticks to carry; by default the pass just before. */
    from: z.number().int('A pass number is a whole number.').min(1).max(100_000).optional(),
  })
  .strict();

export const checklistItemsSchema = z
  .object({
    items: z
      .array(z.object({ id: id('A checklist item id').optional(), text: oneLine('A checklist item').min(1, 'An item needs words.').max(200) }))
      .max(40, 'At most 40 items.'),
  })
  .strict();

export const commentCreateSchema = z
  .object({
    body: longText('The comment').min(1, 'Write something first.').max(4000, 'Keep a comment under 4,000 characters.'),
    parentId: id('The thread id').optional(),
    target: z.enum(COMMENT_TARGETS).default('gag'),
    passId: id('The pass id').optional(),
    panel: z.number().int().min(0).max(3).optional(),
    beat: z.enum(BEAT_KINDS).optional(),
    // A point on the page, in mm: finite and within a metre of it (the page is far smaller).
    x: z.number().finite().min(-1000).max(1000).optional(),
    y: z.number().finite().min(-1000).max(1000).optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    const need = (cond: boolean, message: string) => {
      if (!cond) ctx.addIssue({ code: 'custom', message });
    };
    if (c.parentId) return; // a reply takes its thread's pin
    if (c.target === 'pass' || c.target === 'panel' || c.target === 'point') need(!!c.passId, `A ${c.target} comment names its pass.`);
    if (c.target === 'panel' || c.target === 'point') need(c.panel !== undefined, `A ${c.target} comment names its panel (0–3).`);
    if (c.target === 'point') need(c.x !== undefined && c.y !== undefined, 'A point comment gives x and y in mm.');
    if (c.target === 'beat') need(!!c.beat, 'A beat comment names its beat.');
  });

export const commentPatchSchema = z
  .object({
    body: longText('The comment').min(1, 'Write something first.').max(4000, 'Keep a comment under 4,000 characters.').optional(),
    resolved: z.boolean().optional(),
  })
  .strict()
  .refine((v) => v.body !== undefined || v.resolved !== undefined, 'Send a new body or resolved: true/false.');
