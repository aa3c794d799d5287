/** Writes and reads the audit log of every change. */
import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import {
  auditReferences,
  describeAuditChanges,
  LEVEL_NAMES,
  WORK_TASK_LABELS,
  type AuditAction,
  type AuditEntry,
  type AuditNames,
  type AuditRefKind,
  type Level,
  type WorkTask,
} from '@swardwise/domain';
import { auditLog, crews, districts, equipment, fields, sites, users } from '../db/schema/index.ts';
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

type StoredEntry = Omit<AuditEntry<Date>, 'entityName' | 'changes'>;

export async function listAudit(ctx: Ctx, filter: { entity?: string | undefined; entityId?: number | undefined; limit: number }): Promise<AuditEntry<Date>[]> {
  authorize(ctx, 'read', 'AuditEntry');
  const conditions: SQL[] = [];
  if (filter.entity) conditions.push(eq(auditLog.entity, filter.entity));
  if (filter.entityId) conditions.push(eq(auditLog.entityId, filter.entityId));
  if (ctx.actor.role === 'foreman') conditions.push(inArray(auditLog.districtId, [ctx.actor.districtId ?? -1]));
  const rows: StoredEntry[] = await ctx.db
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
  const names = await auditNames(ctx.db, rows);
  return rows.map((r) => ({ ...r, entityName: entityName(r, names), changes: describeAuditChanges(r.before, r.after, names) }));
}

/** The kind of row an entry's own id points to, where the entry is about such a row. */
const ENTITY_KIND: Readonly<Record<string, AuditRefKind>> = {
  user: 'user',
  user_permissions: 'user',
  account: 'user',
  field: 'field',
  site: 'site',
  crew: 'crew',
  equipment: 'equipment',
};

/** The names of every person, field, site, crew, district and machine the entries mention: one query per kind. */
async function auditNames(db: Queryable, rows: readonly StoredEntry[]): Promise<AuditNames> {
  const ids = auditReferences(rows);
  for (const r of rows) {
    const kind = ENTITY_KIND[r.entity];
    if (kind && r.entityId !== null) ids[kind].add(r.entityId);
    if (r.districtId !== null) ids.district.add(r.districtId);
  }
  const lookup = async (kind: AuditRefKind, query: (list: number[]) => Promise<{ id: number; name: string }[]>): Promise<[AuditRefKind, Map<number, string>]> => {
    const list = [...ids[kind]];
    return [kind, new Map(list.length ? (await query(list)).map((r) => [r.id, r.name]) : [])];
  };
  const found = await Promise.all([
    lookup('user', (l) => db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, l))),
    lookup('field', (l) =>
      db
        .select({ id: fields.id, name: sql<string>`${fields.name} || ' (' || ${sites.name} || ')'` })
        .from(fields)
        .innerJoin(sites, eq(sites.id, fields.siteId))
        .where(inArray(fields.id, l)),
    ),
    lookup('site', (l) => db.select({ id: sites.id, name: sites.name }).from(sites).where(inArray(sites.id, l))),
    lookup('crew', (l) => db.select({ id: crews.id, name: crews.name }).from(crews).where(inArray(crews.id, l))),
    lookup('district', (l) => db.select({ id: districts.id, name: districts.name }).from(districts).where(inArray(districts.id, l))),
    lookup('equipment', (l) => db.select({ id: equipment.id, name: equipment.name }).from(equipment).where(inArray(equipment.id, l))),
  ]);
  return Object.fromEntries(found) as AuditNames;
}

/**
 * What a person would call the row an entry is about: its own name, a work order's task,
 * field and date, a field's child rows (checks, closures, bookings…) by their field, the
 * week plan by its district; a removed row by the name it had.
 */
function entityName(r: StoredEntry, names: AuditNames): string | null {
  const row = (r.after ?? r.before ?? {}) as Record<string, unknown>;
  const ownName = typeof row.name === 'string' ? row.name : null;
  const kind = ENTITY_KIND[r.entity];
  if (kind && r.entityId !== null) return names[kind]?.get(r.entityId) ?? ownName ?? (typeof row.email === 'string' ? row.email : null);
  if (r.entity === 'standards' && r.entityId !== null && r.entityId in LEVEL_NAMES) return `Level ${r.entityId} · ${LEVEL_NAMES[r.entityId as Level]}`;
  const field = typeof row.fieldId === 'number' ? (names.field?.get(row.fieldId) ?? `field #${row.fieldId}`) : null;
  if (r.entity === 'work_order') {
    const task = typeof row.task === 'string' && row.task in WORK_TASK_LABELS ? WORK_TASK_LABELS[row.task as WorkTask] : 'Work';
    const date = typeof row.plannedDate === 'string' ? `, ${row.plannedDate}` : '';
    if (field) return `${task} on ${field}${date}`;
    // A yard job (no field): its machine at the yard.
    const machine = row.fieldId === null && typeof row.equipmentId === 'number' ? (names.equipment?.get(row.equipmentId) ?? `machine #${row.equipmentId}`) : null;
    return machine ? `${task} — ${machine} at the yard${date}` : `${task}${date}`;
  }
  if (field) return field;
  if (ownName) return ownName;
  if (r.districtId !== null && (r.entity === 'week_plan' || r.entity === 'rain_out')) return names.district?.get(r.districtId) ?? null;
  return null;
}
