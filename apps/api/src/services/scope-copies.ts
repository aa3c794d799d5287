/**
 * Work orders and bookings carry copies of their field's site and district, so scope checks
 * and district lists need no join. A field moved to another site, or a site moved to another
 * district, takes those copies along in the same transaction: the new foreman or partner sees
 * the rows at once and the old one loses them.
 */
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Queryable } from '../db/client.ts';
import { crews, equipment, fieldEvents, fields, sites, workOrders } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';

export interface FollowedMove {
  workOrders: number;
  fieldEvents: number;
  /** Open orders that lost a crew or equipment of the district the field left. */
  unassigned: number;
}

/**
 * Brings the copies of the given fields' (or a site's fields') site and district up to date,
 * and takes open work (planned or assigned) off crews and equipment of another district: they
 * may no longer work there. Done, started and skipped orders keep their crew as history.
 */
export async function followMove(db: Queryable, actorId: number, target: { fieldId: number } | { siteId: number }): Promise<FollowedMove> {
  const which: SQL = 'fieldId' in target ? sql`f.id = ${target.fieldId}` : sql`f.site_id = ${target.siteId}`;
  const orders = await db.execute<{ id: number }>(sql`
    update ${workOrders} wo set site_id = f.site_id, district_id = s.district_id, updated_at = now()
    from ${fields} f join ${sites} s on s.id = f.site_id
    where wo.field_id = f.id and ${which} and (wo.site_id <> f.site_id or wo.district_id <> s.district_id)
    returning wo.id`);
  const events = await db.execute<{ id: number }>(sql`
    update ${fieldEvents} fe set site_id = f.site_id, district_id = s.district_id, updated_at = now()
    from ${fields} f join ${sites} s on s.id = f.site_id
    where fe.field_id = f.id and ${which} and (fe.site_id <> f.site_id or fe.district_id <> s.district_id)
    returning fe.id`);

  const movedIds = orders.rows.map((r) => r.id);
  let unassigned = 0;
  if (movedIds.length) {
    const stranded = await db
      .select({ order: workOrders, crewDistrict: crews.districtId, equipmentDistrict: equipment.districtId })
      .from(workOrders)
      .leftJoin(crews, eq(crews.id, workOrders.crewId))
      .leftJoin(equipment, eq(equipment.id, workOrders.equipmentId))
      .where(and(inArray(workOrders.id, movedIds), inArray(workOrders.status, ['planned', 'assigned'])));
    for (const { order, crewDistrict, equipmentDistrict } of stranded) {
      const foreignCrew = order.crewId !== null && crewDistrict !== order.districtId;
      const foreignEquipment = order.equipmentId !== null && equipmentDistrict !== order.districtId;
      if (!foreignCrew && !foreignEquipment) continue;
      const [after] = await db
        .update(workOrders)
        .set({
          ...(foreignCrew ? { crewId: null, status: 'planned' as const } : {}),
          ...(foreignEquipment ? { equipmentId: null } : {}),
          version: sql`${workOrders.version} + 1`,
          updatedAt: new Date(),
        })
        .where(eq(workOrders.id, order.id))
        .returning();
      await writeAudit(db, { actorId, action: 'update', entity: 'work_order', entityId: order.id, districtId: order.districtId, before: order, after: after ?? null });
      unassigned++;
    }
  }
  return { workOrders: movedIds.length, fieldEvents: events.rows.length, unassigned };
}
