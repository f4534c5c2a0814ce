import { z } from 'zod';
import { oneLine } from './text';

export const createSeriesSchema = z.object({
  title: oneLine('The title').min(1, 'Give the series a title.').max(120, 'Keep the title under 120 characters.'),
});
export type CreateSeriesInput = z.input<typeof createSeriesSchema>;
