/** Parks, complexes and school campuses. */
import { and, asc, eq, sql, type SQL } from 'drizzle-orm';
import { errors, type CreateSiteInput, type SiteRow, type UpdateSiteInput } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { districts, fields, sites } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { followMove } from './scope-copies.ts';
import { siteScope } from './scope.ts';
import { insertAudited, updateVersioned, versionedRows } from './versioned.ts';
import { requireDistrict } from './districts.ts';

const fieldCounts = (db: Ctx['db']) =>
  db
    .select({
      siteId: fields.siteId,
      fieldCount: sql<number>`count(*)::int`.as('field_count'),
      fieldAreaM2: sql<number>`sum(${fields.areaM2})::float8`.as('field_area_m2'),
    })
    .from(fields)
    .groupBy(fields.siteId)
    .as('fc');

function selectSites(db: Ctx['db']) {
  const fc = fieldCounts(db);
  return db
    .select({
      id: sites.id,
      districtId: sites.districtId,
      districtName: districts.name,
      name: sites.name,
      kind: sites.kind,
      owner: sites.owner,
      address: sites.address,
      lat: sites.lat,
      lng: sites.lng,
      notes: sites.notes,
      fieldCount: sql<number>`coalesce(${fc.fieldCount}, 0)`,
      fieldAreaM2: sql<number>`coalesce(${fc.fieldAreaM2}, 0)`,
      version: sites.version,
      updatedAt: sites.updatedAt,
    })
    .from(sites)
    .innerJoin(districts, eq(districts.id, sites.districtId))
    .leftJoin(fc, eq(fc.siteId, sites.id));
}

export async function getSiteRow(db: Ctx['db'], id: number) {
  const [row] = await selectSites(db).where(eq(sites.id, id));
  return row;
}

export const siteRows = versionedRows({ table: sites, subject: 'Site', resource: 'site', row: getSiteRow });

export async function listSites(ctx: Ctx, filter: { districtId?: number | undefined; q?: string | undefined }): Promise<SiteRow<Date>[]> {
  authorize(ctx, 'read', 'Site');
  const conditions: (SQL | undefined)[] = [siteScope(ctx.actor)];
  if (filter.districtId) conditions.push(eq(sites.districtId, filter.districtId));
  if (filter.q) conditions.push(sql`${sites.name} ilike ${'%' + filter.q + '%'}`);
  const rows = await selectSites(ctx.db)
    .where(and(...conditions))
    .orderBy(asc(sites.name));
  return rows.filter((row) => can(ctx, 'read', 'Site', row));
}

export async function getSite(ctx: Ctx, id: number): Promise<SiteRow<Date>> {
  const row = await getSiteRow(ctx.db, id);
  if (!row) throw errors.notFound('site', id);
  authorize(ctx, 'read', 'Site', row);
  return row;
}

export async function createSite(ctx: Ctx, input: CreateSiteInput): Promise<SiteRow<Date>> {
  authorize(ctx, 'create', 'Site', { districtId: input.districtId });
  return (ctx.db as Db).transaction(async (tx) => {
    await requireDistrict(tx, input.districtId);
    return insertAudited(ctx, tx, siteRows, input);
  });
}

export function updateSite(ctx: Ctx, id: number, input: UpdateSiteInput): Promise<SiteRow<Date>> {
  return updateVersioned(ctx, siteRows, id, input, async (tx, before, changes) => {
    if (changes.districtId !== undefined && changes.districtId !== before.districtId) {
      // Moving a site to another district needs the right to create it there too.
      authorize(ctx, 'create', 'Site', { districtId: changes.districtId });
      await requireDistrict(tx, changes.districtId);
    }
    return changes;
  }, async (tx, before, changes) => {
    // The work and bookings of the site's fields go with it to its new district.
    if (changes.districtId !== undefined && changes.districtId !== before.districtId) await followMove(tx, ctx.actor.id, { siteId: id });
  });
}
