/** A district's mowers, line markers, spreaders and sprayers, with hour meters and blade care. */
import { and, asc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { bladeCare, errors, type CreateEquipmentInput, type EquipmentRow, type UpdateEquipmentInput } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { crews, districts, equipment, workOrders } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { deleteVersioned, insertAudited, updateVersioned, versionedRows } from './versioned.ts';
import { requireDistrict } from './districts.ts';

const columns = {
  id: equipment.id,
  districtId: equipment.districtId,
  districtName: districts.name,
  crewId: equipment.crewId,
  crewName: sql<string | null>`${crews.name}`,
  kind: equipment.kind,
  name: equipment.name,
  cuttingWidthM: equipment.cuttingWidthM,
  speedKmh: equipment.speedKmh,
  fieldEfficiency: equipment.fieldEfficiency,
  hocMinMm: equipment.hocMinMm,
  hocMaxMm: equipment.hocMaxMm,
  hourMeterH: equipment.hourMeterH,
  sharpenIntervalH: equipment.sharpenIntervalH,
  lastSharpenedAtH: equipment.lastSharpenedAtH,
  notes: equipment.notes,
  active: equipment.active,
  version: equipment.version,
  updatedAt: equipment.updatedAt,
};

function select(db: Ctx['db']) {
  return db.select(columns).from(equipment).innerJoin(districts, eq(districts.id, equipment.districtId)).leftJoin(crews, eq(crews.id, equipment.crewId));
}

/**
 * Blade care by `bladeCare` (the engine's one rule): due when the hours run since the last
 * sharpening reach the interval, due soon when this week's open mowings on the machine would.
 */
function withBladeCare<T extends { hourMeterH: number; sharpenIntervalH: number | null; lastSharpenedAtH: number | null }>(row: T, weekMowingH = 0) {
  const care = bladeCare(row, weekMowingH);
  return { ...row, hoursSinceSharpening: care.hoursSince, sharpeningDue: care.state === 'due', bladeState: care.state, weekMowingH: Math.round(weekMowingH * 100) / 100 };
}

/** Hours of open mowing (planned, assigned, started) on each machine in the department's current week. */
async function weekMowingHours(ctx: Ctx, ids: number[]): Promise<Map<number, number>> {
  if (ids.length === 0) return new Map();
  const rows = await ctx.db
    .select({ id: workOrders.equipmentId, hours: sql<number>`sum(${workOrders.plannedHours})`.mapWith(Number) })
    .from(workOrders)
    .where(and(inArray(workOrders.equipmentId, ids), eq(workOrders.task, 'mow'), eq(workOrders.weekStart, ctx.clock.weekStart()), inArray(workOrders.status, ['planned', 'assigned', 'started'])))
    .groupBy(workOrders.equipmentId);
  return new Map(rows.flatMap((r) => (r.id === null ? [] : [[r.id, r.hours] as const])));
}

export async function getRow(db: Ctx['db'], id: number) {
  const [row] = await select(db).where(eq(equipment.id, id));
  return row;
}

export const equipmentRows = versionedRows({ table: equipment, subject: 'Equipment', resource: 'equipment', row: getRow });

export async function listEquipment(ctx: Ctx, filter: { districtId?: number | undefined }): Promise<EquipmentRow<Date>[]> {
  authorize(ctx, 'read', 'Equipment');
  const conditions: (SQL | undefined)[] = [];
  if (ctx.actor.role === 'foreman') conditions.push(eq(equipment.districtId, ctx.actor.districtId ?? -1));
  if (ctx.actor.role === 'crew') conditions.push(eq(equipment.crewId, ctx.actor.crewId ?? -1));
  if (filter.districtId) conditions.push(eq(equipment.districtId, filter.districtId));
  const rows = await select(ctx.db)
    .where(and(...conditions))
    .orderBy(asc(equipment.kind), asc(equipment.name));
  const mine = rows.filter((r) => can(ctx, 'read', 'Equipment', r));
  const week = await weekMowingHours(ctx, mine.map((r) => r.id));
  return mine.map((r) => withBladeCare(r, week.get(r.id) ?? 0));
}

/** A crew, when given, must be of the same district. */
async function checkCrew(db: Ctx['db'], crewId: number | null | undefined, districtId: number) {
  if (crewId == null) return;
  const [crew] = await db.select({ districtId: crews.districtId }).from(crews).where(eq(crews.id, crewId));
  if (!crew) throw errors.noSuch('crew', 'body.crewId');
  if (crew.districtId !== districtId) {
    throw errors.invalid('That crew works in another district', [{ path: 'body.crewId', message: 'the crew works in another district' }]);
  }
}

/** A district named in the body must exist (400, not a foreign-key failure). */
export async function createEquipment(ctx: Ctx, input: CreateEquipmentInput): Promise<EquipmentRow<Date>> {
  authorize(ctx, 'create', 'Equipment', { districtId: input.districtId });
  return (ctx.db as Db).transaction(async (tx) => {
    await requireDistrict(tx, input.districtId);
    await checkCrew(tx, input.crewId, input.districtId);
    return withBladeCare(await insertAudited(ctx, tx, equipmentRows, input));
  });
}

export async function updateEquipment(ctx: Ctx, id: number, input: UpdateEquipmentInput): Promise<EquipmentRow<Date>> {
  const after = await updateVersioned(ctx, equipmentRows, id, input, async (tx, before, changes) => {
    const districtId = changes.districtId ?? before.districtId;
    if (districtId !== before.districtId) {
      authorize(ctx, 'create', 'Equipment', { districtId });
      await requireDistrict(tx, districtId);
    }
    await checkCrew(tx, changes.crewId === undefined ? before.crewId : changes.crewId, districtId);
    const merged = { ...before, ...changes };
    if (merged.hocMinMm != null && merged.hocMaxMm != null && merged.hocMinMm > merged.hocMaxMm) {
      throw errors.invalid('The highest HOC is below the lowest', [{ path: 'body.hocMaxMm', message: 'the highest HOC is below the lowest' }]);
    }
    return changes;
  });
  return withBladeCare(after);
}

export function deleteEquipment(ctx: Ctx, id: number, version: number): Promise<void> {
  return deleteVersioned(ctx, equipmentRows, id, version);
}
