/** Mowing crews of a district. */
import { and, asc, eq, sql, type SQL } from 'drizzle-orm';
import { appError, type CreateCrewInput, type CrewRow, type StoredCrew, type UpdateCrewInput } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { crews, districts, users } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { auditRow, deleteVersioned, updateVersioned, versionedRows } from './versioned.ts';
import { requireDistrict } from './districts.ts';

export async function listCrews(ctx: Ctx, filter: { districtId?: number | undefined }): Promise<CrewRow[]> {
  authorize(ctx, 'read', 'Crew', ctx.actor.role === 'crew' ? { id: ctx.actor.crewId ?? -1, districtId: ctx.actor.districtId } : undefined);
  const conditions: (SQL | undefined)[] = [];
  if (ctx.actor.role === 'foreman') conditions.push(eq(crews.districtId, ctx.actor.districtId ?? -1));
  if (ctx.actor.role === 'crew') conditions.push(eq(crews.id, ctx.actor.crewId ?? -1));
  if (filter.districtId) conditions.push(eq(crews.districtId, filter.districtId));
  const rows = await ctx.db
    .select({
      id: crews.id,
      districtId: crews.districtId,
      districtName: districts.name,
      name: crews.name,
      hoursPerDay: crews.hoursPerDay,
      members: crews.members,
      workDays: crews.workDays,
      leadUserId: sql<number | null>`(select min(${users.id}) from ${users} where ${users.crewId} = ${crews.id} and ${users.role} = 'crew')`,
      leadName: sql<string | null>`(select ${users.name} from ${users} where ${users.crewId} = ${crews.id} and ${users.role} = 'crew' order by ${users.id} limit 1)`,
      version: crews.version,
    })
    .from(crews)
    .innerJoin(districts, eq(districts.id, crews.districtId))
    .where(and(...conditions))
    .orderBy(asc(crews.name));
  return rows.filter((row) => can(ctx, 'read', 'Crew', row));
}

export async function crewRow(db: Ctx['db'], id: number) {
  const [row] = await db.select().from(crews).where(eq(crews.id, id));
  return row;
}

export const crewRows = versionedRows({ table: crews, subject: 'Crew', resource: 'crew', row: crewRow });

export async function createCrew(ctx: Ctx, input: CreateCrewInput): Promise<StoredCrew<Date>> {
  authorize(ctx, 'create', 'Crew', { districtId: input.districtId });
  return (ctx.db as Db).transaction(async (tx) => {
    await requireDistrict(tx, input.districtId);
    const [row] = await tx.insert(crews).values(input).returning();
    await auditRow(ctx, tx, 'crew', null, row!);
    return row!;
  });
}

export function updateCrew(ctx: Ctx, id: number, input: UpdateCrewInput): Promise<StoredCrew<Date>> {
  return updateVersioned(ctx, crewRows, id, input, async (tx, before, changes) => {
    if (changes.districtId !== undefined && changes.districtId !== before.districtId) {
      // A crew lead's district follows his crew, so a crew with a lead stays where it is.
      authorize(ctx, 'create', 'Crew', { districtId: changes.districtId });
      await requireDistrict(tx, changes.districtId);
      const [lead] = await tx.select({ id: users.id }).from(users).where(eq(users.crewId, id)).limit(1);
      if (lead) throw appError('crew/has_lead', 'Move the crew lead to another crew before moving this crew to another district');
    }
    return changes;
  });
}

export function deleteCrew(ctx: Ctx, id: number, version: number): Promise<void> {
  return deleteVersioned(ctx, crewRows, id, version, async (tx) => {
    const [lead] = await tx.select({ id: users.id }).from(users).where(eq(users.crewId, id)).limit(1);
    if (lead) throw appError('crew/has_lead', 'This crew still has a crew lead account; move or deactivate it first');
  });
}
