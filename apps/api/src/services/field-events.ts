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
import { deleteVersioned, insertAudited, updateVersioned, versionedRows } from './versioned.ts';

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

export const eventRows = versionedRows({ table: fieldEvents, subject: 'FieldEvent', resource: 'field_event', row: getRow });

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

/**
 * The field a new or moved booking is on, with the site and district the booking copies: it
 * must exist (400) and the caller must be allowed to book it (403).
 */
async function fieldToBook(ctx: Ctx, db: Ctx['db'], fieldId: number) {
  const [field] = await db
    .select({ id: fields.id, siteId: fields.siteId, districtId: sites.districtId })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(eq(fields.id, fieldId));
  if (!field) throw errors.noSuch('field', 'body.fieldId');
  authorize(ctx, 'create', 'FieldEvent', { siteId: field.siteId, districtId: field.districtId });
  return field;
}

export async function createFieldEvent(ctx: Ctx, input: CreateFieldEventInput): Promise<FieldEventRow<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const field = await fieldToBook(ctx, tx, input.fieldId);
    return insertAudited(ctx, tx, eventRows, { ...input, siteId: field.siteId, districtId: field.districtId, createdBy: ctx.actor.id });
  });
}

export function updateFieldEvent(ctx: Ctx, id: number, input: UpdateFieldEventInput): Promise<FieldEventRow<Date>> {
  return updateVersioned(ctx, eventRows, id, input, async (tx, before, changes) => {
    let moved: { siteId: number; districtId: number } | undefined;
    if (changes.fieldId !== undefined && changes.fieldId !== before.fieldId) {
      // Moving a booking to another field is booking that field: the caller must be allowed there too.
      const field = await fieldToBook(ctx, tx, changes.fieldId);
      moved = { siteId: field.siteId, districtId: field.districtId };
    }
    return { ...changes, ...moved };
  });
}

export function deleteFieldEvent(ctx: Ctx, id: number, version: number): Promise<void> {
  return deleteVersioned(ctx, eventRows, id, version);
}
