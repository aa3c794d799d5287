import { z } from 'zod';
import { isoDateSchema as isoDate } from './common.ts';

/** Query of `GET /api/map`: the day the map describes (default today). */
export const mapQuerySchema = z.object({
  asOf: isoDate.optional(),
});
export type MapQuery = z.infer<typeof mapQuerySchema>;
