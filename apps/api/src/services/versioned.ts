/**
 * The writes every edited row goes through: a change or a delete only at the version the
 * client read (else the resource's 409), and an audit entry with the row before and after.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { PgColumn, PgTable, PgUpdateSetSource } from 'drizzle-orm/pg-core';
import { errors, type Action, type NotFoundResource, type ScopedRow, type SubjectName, type VersionedResource } from '@swardwise/domain';
import type { Tx } from '../db/client.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

type VersionedTable = PgTable & { id: PgColumn; version: PgColumn; updatedAt: PgColumn };
type DistrictRow = { id: number; districtId: number | null };

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
