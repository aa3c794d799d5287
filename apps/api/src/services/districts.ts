/** Districts with their yards and a count of what they hold. */
import { asc, eq, sql } from 'drizzle-orm';
import { errors, type DistrictRow } from '@swardwise/domain';
import type { Queryable } from '../db/client.ts';
import { districts, fields, sites } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';

export async function listDistricts(ctx: Ctx): Promise<DistrictRow[]> {
  authorize(ctx, 'read', 'District', ctx.actor.districtId ? { id: ctx.actor.districtId } : undefined);
  const counts = ctx.db
    .select({
      districtId: sites.districtId,
      siteCount: sql<number>`count(distinct ${sites.id})::int`.as('site_count'),
      fieldCount: sql<number>`count(${fields.id})::int`.as('field_count'),
      fieldAreaM2: sql<number>`coalesce(sum(${fields.areaM2}), 0)::float8`.as('field_area_m2'),
    })
    .from(sites)
    .leftJoin(fields, eq(fields.siteId, sites.id))
    .groupBy(sites.districtId)
    .as('counts');
  const rows = await ctx.db
    .select({
      id: districts.id,
      code: districts.code,
      name: districts.name,
      boundary: districts.boundary,
      yardName: districts.yardName,
      yardLat: districts.yardLat,
      yardLng: districts.yardLng,
      version: districts.version,
      siteCount: sql<number>`coalesce(${counts.siteCount}, 0)`,
      fieldCount: sql<number>`coalesce(${counts.fieldCount}, 0)`,
      fieldAreaM2: sql<number>`coalesce(${counts.fieldAreaM2}, 0)`,
    })
    .from(districts)
    .leftJoin(counts, eq(counts.districtId, districts.id))
    .orderBy(asc(districts.code));
  return rows
    .filter((row) => can(ctx, 'read', 'District', { id: row.id }))
    .map(({ yardName, yardLat, yardLng, ...rest }) => ({ ...rest, yard: { name: yardName, lat: yardLat, lng: yardLng } }));
}

/** The district a body names exists (else a 400 on `body.districtId`: the body is wrong, not the address). */
export async function requireDistrict(db: Queryable, id: number): Promise<{ id: number }> {
  const [d] = await db.select({ id: districts.id }).from(districts).where(eq(districts.id, id));
  if (!d) throw errors.noSuch('district', 'body.districtId');
  return d;
}
