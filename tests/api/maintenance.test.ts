/**
 * The embedded database has no autovacuum: the upkeep pass vacuums the tables rewritten all day,
 * so their row versions are reused instead of piling up.
 */
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { CHURNING_TABLES, vacuumChurningTables } from '../../apps/api/src/db/maintenance.ts';

let database: Database;
beforeAll(async () => {
  // PGlite whatever the project: the pass is for the embedded database.
  database = await openDatabase({ pgliteDir: 'memory://' });
  await database.db.execute(sql`insert into sessions (sid, data, expires_at) select 'sid-' || n, '{}'::jsonb, now() from generate_series(1, 500) as n`);
});
afterAll(() => database.close());

/** Every session's expiry written again, as busy sessions do: the indexed column changes, so each update leaves a dead row version. */
const touchAll = () => database.db.execute(sql`update sessions set expires_at = expires_at + interval '1 minute'`);
const pages = async () => Number((await database.db.execute<{ bytes: number }>(sql`select pg_relation_size('sessions') as bytes`)).rows[0]!.bytes) / 8192;

describe('the embedded database’s upkeep', () => {
  test('should vacuum each busy table, so rewritten rows reuse the space of the versions they replaced', async () => {
    for (let i = 0; i < 4; i++) await touchAll();
    const grown = await pages();
    // Without a vacuum the same writes grow the table again.
    for (let i = 0; i < 4; i++) await touchAll();
    const unvacuumed = await pages();
    expect(unvacuumed).toBeGreaterThan(grown * 1.5);

    expect(await vacuumChurningTables(database)).toEqual([...CHURNING_TABLES]);
    for (let i = 0; i < 4; i++) await touchAll();
    expect(await pages()).toBeLessThanOrEqual(unvacuumed);
  });

  test('should leave a PostgreSQL server to its autovacuum', async () => {
    const server = { kind: 'postgres' as const, db: { execute: () => Promise.reject(new Error('no statement expected')) } as unknown as Database['db'] };
    expect(await vacuumChurningTables(server)).toEqual([]);
  });
});
