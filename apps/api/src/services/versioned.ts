/**
 * The writes every edited row goes through: a change or a delete only at the version the
 * client read (else the resource's 409), and an audit entry with the row before and after.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { PgColumn, PgInsertValue, PgTable, PgUpdateSetSource } from 'drizzle-orm/pg-core';
import { errors, type Action, type NotFoundResource, type ScopedRow, type SubjectName, type VersionedResource } from '@swardwise/domain';
import type { Db, Queryable, Tx } from '../db/client.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

type VersionedTable = PgTable & { id: PgColumn; version: PgColumn; updatedAt: PgColumn };
type DistrictRow = { id: number; districtId: number | null };

/**
 * A resource people edit with versions: its table, its name in the abilities, the name of its
 * errors and audit entries, and its row as its writes check and answer it.
 */
export interface VersionedRows<T extends VersionedTable, R extends ScopedRow & DistrictRow> {
  table: T;
  subject: SubjectName;
  resource: NotFoundResource & VersionedResource;
  row: (db: Queryable, id: number) => Promise<R | undefined>;
}

/** `rows` as it is, with its types inferred. */
export function versionedRows<T extends VersionedTable, R extends ScopedRow & DistrictRow>(rows: VersionedRows<T, R>): VersionedRows<T, R> {
  return rows;
}

/** The row a write is about, read in its transaction: 404 when there is none, 403 when the caller may not `action` it. */
export function writable<R extends ScopedRow>(ctx: Ctx, action: Action, subject: SubjectName, resource: NotFoundResource, id: number, row: R | undefined): R {
  if (!row) throw errors.notFound(resource, id);
  authorize(ctx, action, subject, row);
  return row;
}

/** Changes row `id` if it is still at `version`, bumping the version; else throws `<resource>/version_conflict`. */
export async function updateAtVersion<T extends VersionedTable>(tx: Tx, table: T, resource: VersionedResource, id: number, version: number, changes: PgUpdateSetSource<T>): Promise<void> {
  const [updated] = await tx
    .update(table)
    .set({ ...changes, version: sql`${table.version} + 1`, updatedAt: new Date() } as PgUpdateSetSource<T>)
    .where(and(eq(table.id, id), eq(table.version, version)))
    .returning({ id: table.id });
  if (!updated) throw errors.versionConflict(resource);
}

/** Deletes `before` if it is still at `version` (else throws `<entity>/version_conflict`) and audits it. */
export async function deleteAtVersion<T extends VersionedTable>(ctx: Ctx, tx: Tx, table: T, entity: VersionedResource, before: DistrictRow, version: number): Promise<void> {
  const [deleted] = await tx
    .delete(table)
    .where(and(eq(table.id, before.id), eq(table.version, version)))
    .returning({ id: table.id });
  if (!deleted) throw errors.versionConflict(entity);
  await auditRow(ctx, tx, entity, before, null);
}

/** Audits the caller's create (no `before`), update or delete (no `after`) of a district's row. */
export function auditRow(ctx: Ctx, tx: Tx, entity: string, before: DistrictRow | null, after: DistrictRow | null): Promise<void> {
  const row = (after ?? before) as DistrictRow;
  const action = !before ? 'create' : !after ? 'delete' : 'update';
  return writeAudit(tx, { actorId: ctx.actor.id, action, entity, entityId: row.id, districtId: row.districtId, before, after });
}

/** Reads row `id` as the caller's create (no `before`) or change left it, audits the write and answers the row. */
export async function auditedRow<R extends DistrictRow>(ctx: Ctx, tx: Tx, entity: string, before: DistrictRow | null, id: number, read: (db: Queryable, id: number) => Promise<R | undefined>): Promise<R> {
  const after = (await read(tx, id))!;
  await auditRow(ctx, tx, entity, before, after);
  return after;
}

/** Inserts a row the caller has checked, audits it and answers it as `rows.row` reads it. */
export async function insertAudited<T extends VersionedTable, R extends ScopedRow & DistrictRow>(ctx: Ctx, tx: Tx, rows: VersionedRows<T, R>, values: PgInsertValue<T>): Promise<R> {
  const [created] = await tx.insert(rows.table).values(values).returning({ id: rows.table.id });
  return auditedRow(ctx, tx, rows.resource, null, created!.id as number, rows.row);
}

/**
 * A change of row `id` in one transaction: 404 or 403 as `writable`; `change` applies the
 * resource's own rules to the change and gives the columns to set; the update only at the
 * version the client read (else 409); `follow` does what goes with the row after it (its work
 * and bookings moving with it); the audit entry. Answers the row as it is now.
 */
export function updateVersioned<T extends VersionedTable, R extends ScopedRow & DistrictRow, I extends { version: number }>(
  ctx: Ctx,
  rows: VersionedRows<T, R>,
  id: number,
  input: I,
  change: (tx: Tx, before: R, changes: Omit<I, 'version'>) => Promise<PgUpdateSetSource<T>> | PgUpdateSetSource<T>,
  follow?: (tx: Tx, before: R, changes: Omit<I, 'version'>) => Promise<unknown>,
): Promise<R> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = writable(ctx, 'update', rows.subject, rows.resource, id, await rows.row(tx, id));
    const { version, ...changes } = input;
    await updateAtVersion(tx, rows.table, rows.resource, id, version, await change(tx, before, changes));
    if (follow) await follow(tx, before, changes);
    return auditedRow(ctx, tx, rows.resource, before, id, rows.row);
  });
}

/** A delete of row `id` in one transaction: 404 or 403 as `writable`, `check` (what would refuse it), then `deleteAtVersion`. */
export function deleteVersioned<T extends VersionedTable, R extends ScopedRow & DistrictRow>(ctx: Ctx, rows: VersionedRows<T, R>, id: number, version: number, check?: (tx: Tx, before: R) => Promise<void>): Promise<void> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = writable(ctx, 'delete', rows.subject, rows.resource, id, await rows.row(tx, id));
    if (check) await check(tx, before);
    await deleteAtVersion(ctx, tx, rows.table, rows.resource, before, version);
  });
}
