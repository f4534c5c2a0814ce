import { z } from 'zod';

export const createSeriesSchema = z.object({
  title: z.string().trim().min(1, 'Give the series a title.').max(120, 'Keep the title under 120 characters.'),
});
export type CreateSeriesInput = z.input<typeof createSeriesSchema>;
