/**
 * Upkeep the embedded database needs and a PostgreSQL server does by itself. PGlite runs no
 * autovacuum: every update leaves the old row version behind until a VACUUM, so tables whose
 * rows are rewritten all day (the change counters, the summary tables kept by triggers,
 * sessions, rate limits, the mail outbox) grow without bound and their index scans read every
 * dead version. On the big city the crews' year-to-date summary held 180 MB for 110,000 live
 * rows, and one month's 3,048 rows came through 108,365 index entries.
 */
import { sql } from 'drizzle-orm';
import type { Database } from './client.ts';

/** Tables rewritten in place by triggers or on every request; small, so a VACUUM of each takes milliseconds once kept up. */
export const CHURNING_TABLES = [
  'answer_versions',
  'rollup_state',
  'rollup_overview_day',
  'rollup_compare_crew_ytd',
  'rollup_compare_machine_ytd',
  'rollup_compare_site_versions',
  'rollup_field_latest',
  'sessions',
  'rate_limits',
  'mail_outbox',
] as const;

/**
 * Vacuums and analyses the churning tables on embedded PGlite, one at a time (each holds the
 * one connection only for its own table). On PostgreSQL, autovacuum does this: nothing to do.
 * @returns the tables vacuumed
 */
export async function vacuumChurningTables(database: Pick<Database, 'db' | 'kind'>): Promise<string[]> {
  if (database.kind !== 'pglite') return [];
  for (const table of CHURNING_TABLES) await database.db.execute(sql.raw(`vacuum (analyze) ${table}`));
  return [...CHURNING_TABLES];
}
