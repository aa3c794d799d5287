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

/**
 * Keys that never reach the log, at any depth: passwords, tokens, secrets, API keys and their
 * hashes (`passwordHash`, `tokenHash`, `clientSecret`, `api_key`). A flag such as
 * `passwordReset: true` says that something happened, not what, and stays.
 */
const SECRET_KEY = /(password|passwd|token|secret|api_?key)(_?hash)?$/i;

/** A copy of a row as JSON, without its secrets. */
export function redact(row: object | null): Record<string, unknown> | null {
  if (!row) return null;
  return JSON.parse(JSON.stringify(row), (key, value: unknown) => (SECRET_KEY.test(key) ? undefined : value)) as Record<string, unknown>;
}

/**
 * The one way rows reach the audit log: one entry or many, each redacted first. Many entries
 * travel as one JSON parameter (json_to_recordset): PGlite is slow with thousands of bound
 * parameters, and a week plan writes thousands of entries at once.
 */
export async function writeAudit(db: Queryable, entries: AuditInput | readonly AuditInput[]): Promise<void> {
  const rows = (Array.isArray(entries) ? (entries as readonly AuditInput[]) : [entries as AuditInput]).map((e) => ({ ...e, before: redact(e.before), after: redact(e.after) }));
  if (rows.length === 0) return;
  if (rows.length === 1) {
    await db.insert(auditLog).values(rows[0]!);
    return;
  }
  await db.execute(sql`
    insert into ${auditLog} (actor_id, action, entity, entity_id, district_id, before, after)
    select "actorId", action, entity, "entityId", "districtId", before, after
    from json_to_recordset(${JSON.stringify(rows)}::json) as x("actorId" int, action text, entity text, "entityId" int, "districtId" int, before jsonb, after jsonb)`);
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
