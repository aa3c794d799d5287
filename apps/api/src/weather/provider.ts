/**
 * The wire format of the hosted forecast/observation service this product reads, and its
 * zod schema. The local fake serves the same format.
 *
 *   GET {base}/v1/daily?lat=..&lng=..&from=YYYY-MM-DD&to=YYYY-MM-DD   (header X-Api-Key)
 *   → { "location": { "lat", "lng", "elevation_m" },
 *       "days": [ { "date", "kind": "observed"|"forecast", "t_max_c", "t_min_c", "rh_max_pct",
 *                   "rh_min_pct", "wind_2m_ms", "sunshine_h", "solar_mj", "rain_mm" } ] }
 */
import { z } from 'zod';

export const providerDaySchema = z.object({
  date: z.string(),
  kind: z.enum(['observed', 'forecast']),
  t_max_c: z.number(),
  t_min_c: z.number(),
  rh_max_pct: z.number().nullable(),
  rh_min_pct: z.number().nullable(),
  wind_2m_ms: z.number().nullable(),
  sunshine_h: z.number().nullable(),
  solar_mj: z.number().nullable(),
  rain_mm: z.number(),
});
export type ProviderDay = z.infer<typeof providerDaySchema>;

export const providerResponseSchema = z.object({
  location: z.object({ lat: z.number(), lng: z.number(), elevation_m: z.number().nullable() }),
  // Rows are checked one by one later, so one bad row is reported, not the whole answer lost.
  days: z.array(z.unknown()),
});
