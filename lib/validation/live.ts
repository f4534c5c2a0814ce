// Query and body values of the live streams and presence.
import { z } from 'zod';

export const presenceWhere = z.string().regex(/^(page|pass:\d{1,4}|compare)$/, 'where is "page", "compare" or "pass:N".');
export const tabId = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'tab is 1–64 letters, digits, "_" or "-".');
export const panelParam = z.coerce.number().int().min(0).max(3);

/** The query of a stream that also says who is here: `?tab=…&where=…&panel=…` (all optional). */
export const streamQuery = z.object({
  tab: tabId.optional(),
  where: presenceWhere.optional(),
  panel: panelParam.optional(),
});

/** A presence beat without a stream, or a move to another panel: `{ where, tab?, panel? }`. */
export const presenceBeatSchema = z
  .object({
    where: presenceWhere,
    // The tab's id, as given to its live stream; tabs without a stream share one row per person.
    tab: tabId.default('poll'),
    panel: z.number().int().min(0).max(3).nullable().optional(),
  })
  .strict();
