/**
 * vitest global setup of the `api-pg` project: one PostgreSQL server for the whole run with
 * two template databases, migrated (`sw_migrated`) and migrated with the test city
 * (`sw_fixture`). Each test file clones the one it needs (`CREATE DATABASE … TEMPLATE`, a
 * file copy on the server) instead of migrating and seeding again.
 */
import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { buildFixture, type Fixture } from './fixture.ts';
import { startCluster } from './postgres-cluster.ts';

export interface PostgresRun {
  /** The server with the superuser and no database: append `/<database>`. */
  baseUrl: string;
  /** Folder of the server's programs (pg_dump, pg_restore). */
  binDir: string;
  /** Folder the cluster lives in (its unix socket too). */
  dataDir: string;
  /** The test city of `sw_fixture`, as `buildFixture` returned it. */
  fixture: Fixture;
}

declare module 'vitest' {
  export interface ProvidedContext {
    postgres: PostgresRun;
  }
}

export const MIGRATED_TEMPLATE = 'sw_migrated';
export const FIXTURE_TEMPLATE = 'sw_fixture';

export async function adminQuery(baseUrl: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: `${baseUrl}/postgres` });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

export default async function setup(project: TestProject): Promise<() => void> {
  const started = Date.now();
  const cluster = await startCluster();
  try {
    await adminQuery(cluster.baseUrl, `create database ${MIGRATED_TEMPLATE}`);
    const migrated = await openDatabase({ databaseUrl: `${cluster.baseUrl}/${MIGRATED_TEMPLATE}` });
    await migrated.close();
    await adminQuery(cluster.baseUrl, `create database ${FIXTURE_TEMPLATE} template ${MIGRATED_TEMPLATE}`);
    const seeded = await openDatabase({ databaseUrl: `${cluster.baseUrl}/${FIXTURE_TEMPLATE}` });
    const fixture = await buildFixture(seeded.db);
    await seeded.close();
    project.provide('postgres', { baseUrl: cluster.baseUrl, binDir: cluster.binDir, dataDir: cluster.dataDir, fixture });
  } catch (err) {
    cluster.stop();
    throw err;
  }
  console.log(`PostgreSQL for the api-pg tests: ${cluster.baseUrl} (${cluster.binDir}), templates ready in ${Date.now() - started} ms`);
  return () => cluster.stop();
}
