import { z } from 'zod';
import { isoToDayNumber } from '../engine/dates.ts';

/** Largest value of PostgreSQL's `integer`, the type of every id and version column. */
export const PG_INTEGER_MAX = 2_147_483_647;

/** A positive integer id in a route parameter or body. */
export const idSchema = z.coerce
  .number({ error: 'must be a number' })
  .int('must be a whole number')
  .positive('must be a positive id')
  .max(PG_INTEGER_MAX, `must be an id of at most ${PG_INTEGER_MAX}`);
export const idParamSchema = z.object({ id: idSchema });

/** The optimistic-concurrency version every editable row carries. */
export const versionSchema = z
  .number({ error: 'version is required (the row version you last read)' })
  .int('version must be a whole number')
  .min(1, 'version must be at least 1')
  .max(PG_INTEGER_MAX, `version must be at most ${PG_INTEGER_MAX}`);

/** The body of a change to an editable row: any of its `fields`, and the version the client read. */
export const changeOf = <S extends z.ZodRawShape>(fields: S) => z.object(fields).partial().extend({ version: versionSchema });

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

/** True for a YYYY-MM-DD that names a day of the proleptic Gregorian calendar (no 31 April). */
function isCalendarDate(s: string): boolean {
  try {
    isoToDayNumber(s);
    return true;
  } catch {
    return false;
  }
}

/** Calendar dates the product accepts: wide enough for any record, narrow enough for every date type. */
export const DATE_RANGE = { first: '1900-01-01', last: '2200-12-31' } as const;

/** An ISO calendar date, YYYY-MM-DD, that exists (no 31 April) and lies in `DATE_RANGE`; one message per bad value. */
export const isoDateSchema = z.string({ error: 'use a date as YYYY-MM-DD' }).superRefine((s, ctx) => {
  const message = (() => {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return 'use a date as YYYY-MM-DD';
    if (!isCalendarDate(s)) return 'not a calendar date';
    if (s < DATE_RANGE.first || s > DATE_RANGE.last) return `use a date between ${DATE_RANGE.first} and ${DATE_RANGE.last}`;
    return null;
  })();
  if (message) ctx.addIssue({ code: 'custom', message });
});

/** An ISO 8601 date and time with its offset, in the years of `DATE_RANGE`. */
export const isoDateTimeSchema = z.iso
  .datetime({ offset: true, error: 'use a date and time (ISO 8601)' })
  .refine((s) => s.slice(0, 10) >= DATE_RANGE.first && s.slice(0, 10) <= DATE_RANGE.last, `use a date between ${DATE_RANGE.first} and ${DATE_RANGE.last}`);
