/** Writes and reads the audit log of every change. */
import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { AuditAction, AuditEntry } from '@swardwise/domain';
import { auditLog, users } from '../db/schema/index.ts';
import type { Queryable } from '../db/client.ts';
import { authorize, type Ctx } from './context.ts';

/** Changes to rows, and the account events (sign-in, failed sign-in, sign-out, reset request). */
export type { AuditAction } from '@swardwise/domain';

export interface AuditInput {
  actorId: number | null;
  action: AuditAction;
  entity: string;
  entityId: number | null;
  districtId: number | null;
  before: object | null;
  after: object | null;
}

/** Passwords and hashes never reach the log. */
function redact(row: object | null): Record<string, unknown> | null {
  if (!row) return null;
  const copy: Record<string, unknown> = JSON.parse(JSON.stringify(row));
  delete copy.passwordHash;
  delete copy.tokenHash;
  delete copy.password;
  delete copy.token;
  return copy;
}

export async function writeAudit(db: Queryable, entry: AuditInput): Promise<void> {
  await db.insert(auditLog).values({ ...entry, before: redact(entry.before), after: redact(entry.after) });
}

export async function listAudit(ctx: Ctx, filter: { entity?: string | undefined; entityId?: number | undefined; limit: number }): Promise<AuditEntry<Date>[]> {
  authorize(ctx, 'read', 'AuditEntry');
  const conditions: SQL[] = [];
  if (filter.entity) conditions.push(eq(auditLog.entity, filter.entity));
  if (filter.entityId) conditions.push(eq(auditLog.entityId, filter.entityId));
  if (ctx.actor.role === 'foreman') conditions.push(inArray(auditLog.districtId, [ctx.actor.districtId ?? -1]));
  const rows = await ctx.db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      actorId: auditLog.actorId,
      actorName: sql<string | null>`${users.name}`,
      action: auditLog.action,
      entity: auditLog.entity,
      entityId: auditLog.entityId,
      districtId: auditLog.districtId,
      before: auditLog.before,
      after: auditLog.after,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(conditions.length ? and(...conditions) : undefined)
    .orderBy(desc(auditLog.id))
    .limit(filter.limit);
  return rows;
}
