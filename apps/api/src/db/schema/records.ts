/** The audit log and department-wide settings. */
import { bigint, index, integer, jsonb, pgTable, text } from 'drizzle-orm/pg-core';
import { users } from './people.ts';
import { instant, updatedAt } from './columns.ts';

/** Every write: who, when, what, and the row before and after. Never updated or deleted. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    at: instant('at').notNull().defaultNow(),
    actorId: integer('actor_id').references(() => users.id),
    /** create, update, delete; for accounts also sign_in, sign_in_failed, sign_out, reset_requested. */
    action: text('action').$type<'create' | 'update' | 'delete' | 'sign_in' | 'sign_in_failed' | 'sign_out' | 'reset_requested'>().notNull(),
    entity: text('entity').notNull(),
    entityId: integer('entity_id'),
    /** District the row belongs to, so a foreman can read his district's history. */
    districtId: integer('district_id'),
    before: jsonb('before').$type<Record<string, unknown> | null>(),
    after: jsonb('after').$type<Record<string, unknown> | null>(),
  },
  (t) => [index('audit_entity_idx').on(t.entity, t.entityId), index('audit_district_idx').on(t.districtId, t.at)],
);

/** Key/value settings of the installation (session secret, demo marker, department parameters). */
export const settings = pgTable('settings', {
  key: text('key').primaryKey(),
  value: jsonb('value').notNull(),
  ...updatedAt,
});

/**
 * One change counter per table the cached answers read (fields, sites, work orders, …),
 * bumped by `answer_version_*` triggers in the same transaction as the write. Reading these
 * few rows tells every API process whether its cached answers are still current, where
 * summing over the tables themselves took a scan of all work orders per request.
 */
export const answerVersions = pgTable('answer_versions', {
  /** The table written (the trigger's TG_TABLE_NAME). */
  scope: text('scope').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
});
