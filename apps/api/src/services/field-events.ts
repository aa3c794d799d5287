/**
 * Bookings of a field (games, tournaments, practices…): who plays when, so lines are painted
 * and mowing is timed before them. Each row carries its field's site and district for scope.
 */
import { and, asc, eq, gte, lte, sql, type SQL } from 'drizzle-orm';
import { errors, type Actor, type CreateFieldEventInput, type FieldEventRow, type UpdateFieldEventInput } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { fieldEvents, fields, sites } from '../db/schema/index.ts';
import { authorize, can, type Ctx } from './context.ts';
import { placeScope } from './scope.ts';
import { auditRow, deleteAtVersion, updateAtVersion, writable } from './versioned.ts';

export interface FieldEventFilter {
  from: string;
  to: string;
  fieldId?: number | undefined;
  siteId?: number | undefined;
  districtId?: number | undefined;
}

/** A booking as its own row has it; the partner's page reads these too. */
export const bookingFacts = {
  kind: fieldEvents.kind,
  title: fieldEvents.title,
  startsOn: fieldEvents.startsOn,
  startTime: fieldEvents.startTime,
  notes: fieldEvents.notes,
  createdBy: fieldEvents.createdBy,
  version: fieldEvents.version,
};

const columns = {
  id: fieldEvents.id,
  fieldId: fieldEvents.fieldId,
  fieldName: fields.name,
  siteId: fieldEvents.siteId,
  siteName: sites.name,
  districtId: fieldEvents.districtId,
  ...bookingFacts,
  updatedAt: fieldEvents.updatedAt,
};

function select(db: Ctx['db']) {
  return db.select(columns).from(fieldEvents).innerJoin(fields, eq(fields.id, fieldEvents.fieldId)).innerJoin(sites, eq(sites.id, fieldEvents.siteId));
}

export async function getRow(db: Ctx['db'], id: number) {
  const [row] = await select(db).where(eq(fieldEvents.id, id));
  return row;
}

/** The same rule as the FieldEvent ability, in SQL: undefined means every booking. */
const eventScope = (actor: Actor): SQL | undefined => placeScope(actor, fieldEvents.districtId, fieldEvents.siteId);

export async function listFieldEvents(ctx: Ctx, filter: FieldEventFilter): Promise<FieldEventRow<Date>[]> {
  authorize(ctx, 'read', 'FieldEvent');
  const conditions: (SQL | undefined)[] = [eventScope(ctx.actor), gte(fieldEvents.startsOn, filter.from), lte(fieldEvents.startsOn, filter.to)];
  if (filter.fieldId) conditions.push(eq(fieldEvents.fieldId, filter.fieldId));
  if (filter.siteId) conditions.push(eq(fieldEvents.siteId, filter.siteId));
  if (filter.districtId) conditions.push(eq(fieldEvents.districtId, filter.districtId));
  const rows = await select(ctx.db)
    .where(and(...conditions))
    .orderBy(asc(fieldEvents.startsOn), sql`${fieldEvents.startTime} asc nulls first`, asc(sites.name), asc(fields.name));
  return rows.filter((row) => can(ctx, 'read', 'FieldEvent', row));
}

/** The field a booking is on, with the site and district the booking copies. */
async function fieldOf(db: Ctx['db'], fieldId: number) {
  const [field] = await db
    .select({ id: fields.id, siteId: fields.siteId, districtId: sites.districtId })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(eq(fields.id, fieldId));
  if (!field) throw errors.noSuch('field', 'body.fieldId');
  return field;
}

export async function createFieldEvent(ctx: Ctx, input: CreateFieldEventInput): Promise<FieldEventRow<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const field = await fieldOf(tx, input.fieldId);
    authorize(ctx, 'create', 'FieldEvent', { siteId: field.siteId, districtId: field.districtId });
    const [created] = await tx
      .insert(fieldEvents)
      .values({ ...input, siteId: field.siteId, districtId: field.districtId, createdBy: ctx.actor.id })
      .returning({ id: fieldEvents.id });
    const row = (await getRow(tx, created!.id))!;
    await auditRow(ctx, tx, 'field_event', null, row);
    return row;
  });
}

export async function updateFieldEvent(ctx: Ctx, id: number, input: UpdateFieldEventInput): Promise<FieldEventRow<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = writable(ctx, 'update', 'FieldEvent', 'field_event', id, await getRow(tx, id));
    const { version, ...changes } = input;
    let moved: { siteId: number; districtId: number } | undefined;
    if (changes.fieldId !== undefined && changes.fieldId !== before.fieldId) {
      // Moving a booking to another field is booking that field: the caller must be allowed there too.
      const field = await fieldOf(tx, changes.fieldId);
      authorize(ctx, 'create', 'FieldEvent', { siteId: field.siteId, districtId: field.districtId });
      moved = { siteId: field.siteId, districtId: field.districtId };
    }
    await updateAtVersion(tx, fieldEvents, 'field_event', id, version, { ...changes, ...moved });
    const after = (await getRow(tx, id))!;
    await auditRow(ctx, tx, 'field_event', before, after);
    return after;
  });
}

export async function deleteFieldEvent(ctx: Ctx, id: number, version: number): Promise<void> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = writable(ctx, 'delete', 'FieldEvent', 'field_event', id, await getRow(tx, id));
    await deleteAtVersion(ctx, tx, fieldEvents, 'field_event', before, version);
  });
}
