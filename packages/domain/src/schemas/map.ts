import { z } from 'zod';

/** ISO calendar date, YYYY-MM-DD. */
const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'date must be YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'not a calendar date');

/** Query of `GET /api/map`: the day the map describes (default today). */
export const mapQuerySchema = z.object({
  asOf: isoDate.optional(),
});
export type MapQuery = z.infer<typeof mapQuerySchema>;
