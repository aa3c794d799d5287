/**
 * The write check of what hangs off one field (its stripe pattern, line plan, logos): the
 * field's scope, and whether the caller may change the field.
 */
import { eq } from 'drizzle-orm';
import type { Queryable } from '../db/client.ts';
import { fields, sites } from '../db/schema/index.ts';
import type { Ctx } from './context.ts';
import { writable } from './versioned.ts';

/**
 * 404 for a missing field, 403 unless the caller may change it; run before the body is read,
 * and again inside the write's transaction (`db`). Answers the field's name, scope and outline.
 */
export async function authorizeFieldWrite(ctx: Ctx, fieldId: number, db: Queryable = ctx.db) {
  const [row] = await db.select({ id: fields.id, name: fields.name, siteId: fields.siteId, districtId: sites.districtId, geometry: fields.geometry }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, fieldId));
  return writable(ctx, 'update', 'Field', 'field', fieldId, row);
}
