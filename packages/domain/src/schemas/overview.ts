import { z } from 'zod';
import { idSchema } from './common.ts';

/** The overview asked for: one district (a foreman's is his own) and a season year (default: the department's current one). */
export const overviewQuerySchema = z.object({
  districtId: idSchema.optional(),
  season: z.coerce
    .number({ error: 'the season is a year' })
    .int('the season is a whole year')
    .min(2000, 'the season is a year from 2000 on')
    .max(2100, 'the season is a year up to 2100')
    .optional(),
});
export type OverviewQuery = z.infer<typeof overviewQuerySchema>;
