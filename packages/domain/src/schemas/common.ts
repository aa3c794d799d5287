import { z } from 'zod';

/** A positive integer id in a route parameter or body. */
export const idSchema = z.coerce.number({ error: 'must be a number' }).int('must be a whole number').positive('must be a positive id');
export const idParamSchema = z.object({ id: idSchema });

/** The optimistic-concurrency version every editable row carries. */
export const versionSchema = z.number({ error: 'version is required (the row version you last read)' }).int().min(1);

const position = z
  .tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)], {
    error: 'each position must be [longitude, latitude] in degrees',
  })
  .rest(z.number());

/**
 * Most positions an outline may have, over all its rings. A surveyed field needs a few
 * hundred at most; the bound keeps every outline computation (area, long axis, mowing
 * passes) short for the one request and for everyone queued behind it.
 */
export const MAX_OUTLINE_POSITIONS = 5_000;
const maxPositions = MAX_OUTLINE_POSITIONS.toLocaleString('en-US');

/** A GeoJSON Polygon (RFC 7946): closed rings of [lon, lat] positions, at most `MAX_OUTLINE_POSITIONS` in all. */
export const polygonSchema = z.object({
  type: z.literal('Polygon', { error: 'geometry type must be "Polygon"' }),
  coordinates: z
    .array(
      z
        .array(position)
        .min(4, 'a ring needs at least 4 positions (3 corners and the closing one)')
        .max(MAX_OUTLINE_POSITIONS, `a ring may have at most ${maxPositions} positions; simplify the outline`)
        .refine((ring) => {
          const a = ring[0];
          const b = ring[ring.length - 1];
          return !!a && !!b && a[0] === b[0] && a[1] === b[1];
        }, 'a ring must end where it starts'),
    )
    .min(1, 'a polygon needs an outer ring')
    .refine(
      (rings) => rings.reduce((n, ring) => n + ring.length, 0) <= MAX_OUTLINE_POSITIONS,
      `an outline may have at most ${maxPositions} positions in all its rings; simplify it`,
    ),
});
export type Polygon = z.infer<typeof polygonSchema>;

export const listQuerySchema = z.object({
  districtId: idSchema.optional(),
  siteId: idSchema.optional(),
  q: z.string().trim().max(100).optional(),
});
