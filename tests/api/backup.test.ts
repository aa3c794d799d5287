/**
 * Backups restore every row: the embedded database through PGlite's data-folder dump
 * (`npm run db:dump` / `db:restore`, apps/api/src/db/backup.ts), a PostgreSQL server's
 * through pg_dump and pg_restore (project `api-pg`). Each table's row count and a checksum
 * of its rows must be the same after the restore as before the dump.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { dumpPglite, restorePglite } from '../../apps/api/src/db/backup.ts';
import { openDatabase, type Db } from '../../apps/api/src/db/client.ts';
import { addUser, buildFixture, giveWork } from '../support/fixture.ts';
import { clonePostgresDatabase } from '../support/app.ts';
import { adminQuery } from '../support/postgres-setup.ts';

const postgres = inject('postgres');

/** Every table of the schema: its row count and an md5 of its rows in a fixed order. */
async function contents(db: Db): Promise<Record<string, string>> {
  const query = async <T,>(text: string) => (await db.execute(sql.raw(text))).rows as T[];
  const tables = await query<{ schema: string; name: string }>("select schemaname as schema, tablename as name from pg_tables where schemaname in ('public', 'drizzle') order by 1, 2");
  const parts = tables.map((t) => `select '${t.schema}.${t.name}' as t, count(*)::text || ':' || coalesce(md5(string_agg(x::text, '|' order by x::text)), '') as v from "${t.schema}"."${t.name}" x`);
  const rows = await query<{ t: string; v: string }>(parts.join(' union all '));
  return Object.fromEntries(rows.map((r) => [r.t, r.v]));
}

/** A database with the test city, a work order, an extra user and its audit trail. */
async function fill(db: Db) {
  const f = await buildFixture(db);
  await giveWork(db, f.fields.northSoccer, f.crews.north, 1);
  await addUser(db, 'backup-check', 'foreman', { districtId: f.districts.south });
}

const rowsIn = (c: Record<string, string>) => Object.values(c).reduce((n, v) => n + Number(v.split(':')[0]), 0);

describe('backups', () => {
  test.skipIf(Boolean(postgres))('should restore a PGlite data-folder dump with every row of every table', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-backup-'));
    try {
      const original = await openDatabase({ pgliteDir: path.join(dir, 'live') });
      await fill(original.db);
      const before = await contents(original.db);
      await original.close();

      const dump = await dumpPglite(path.join(dir, 'live'));
      await expect(restorePglite(dump, path.join(dir, 'live'))).rejects.toThrow(/not empty/);
      await restorePglite(dump, path.join(dir, 'restored'));
      const restored = await openDatabase({ pgliteDir: path.join(dir, 'restored') });
      const after = await contents(restored.db);
      await restored.close();

      expect(rowsIn(before)).toBeGreaterThan(50);
      expect(after).toEqual(before);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);

  test.skipIf(!postgres)('should restore a pg_dump of a PostgreSQL database into a new one with every row of every table', async () => {
    const source = await clonePostgresDatabase('empty');
    // The restore goes into a database as createdb makes it: no schema, no migrations table.
    const target = `restore_${process.pid}_${Date.now()}`;
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-pgdump-'));
    try {
      const original = await openDatabase({ databaseUrl: source.url });
      await fill(original.db);
      const before = await contents(original.db);
      await original.close();

      const file = path.join(dir, 'swardwise.dump');
      execFileSync(path.join(postgres.binDir, 'pg_dump'), ['--format=custom', '--file', file, '--dbname', source.url]);
      await adminQuery(postgres.baseUrl, `create database ${target}`);
      execFileSync(path.join(postgres.binDir, 'pg_restore'), ['--no-owner', '--exit-on-error', '--dbname', `${postgres.baseUrl}/${target}`, file]);

      // Opened as the server opens it: the restored migrations table means nothing is migrated again.
      const restored = await openDatabase({ databaseUrl: `${postgres.baseUrl}/${target}` });
      const after = await contents(restored.db);
      await restored.close();

      expect(rowsIn(before)).toBeGreaterThan(50);
      expect(after).toEqual(before);
    } finally {
      await source.drop();
      await adminQuery(postgres.baseUrl, `drop database if exists ${target} with (force)`);
      fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
