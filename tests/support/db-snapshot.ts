/**
 * Migrating a new PGlite database and building the fixture city takes seconds, and every API
 * test file used to do both. This global setup does it once per run and dumps the data folder
 * twice (migrated and empty; migrated with the fixture); `openPgliteCopy` starts each file's
 * in-memory database from a copy of a dump (PGlite `loadDataDir`). The migrations still run on
 * every copy (`openDatabase`), and find nothing left to do.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inject } from 'vitest';
import type { TestProject } from 'vitest/node';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { buildFixture, type Fixture } from './fixture.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The folder of the run's database dumps (empty when the files open their own). */
    apiDatabaseSnapshot: string;
  }
}

type Dumpable = { $client: { dumpDataDir(compression: 'none'): Promise<Blob | File> } };

async function dump(database: Database, file: string) {
  const blob = await (database.db as unknown as Dumpable).$client.dumpDataDir('none');
  fs.writeFileSync(file, Buffer.from(await blob.arrayBuffer()));
}

export default async function setup(project: TestProject) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-api-db-'));
  const database = await openDatabase({ pgliteDir: 'memory://' });
  try {
    await dump(database, path.join(dir, 'migrated.tar'));
    const fixture = await buildFixture(database.db);
    await dump(database, path.join(dir, 'fixture.tar'));
    fs.writeFileSync(path.join(dir, 'fixture.json'), JSON.stringify(fixture));
  } finally {
    await database.close();
  }
  project.provide('apiDatabaseSnapshot', dir);
  return () => fs.rmSync(dir, { recursive: true, force: true });
}

/**
 * A new in-memory database for one test file: migrated and empty, or with the fixture city
 * (and its ids). From the run's dump when there is one, else built here.
 */
export async function openPgliteCopy(withFixture: true): Promise<{ database: Database; fixture: Fixture }>;
export async function openPgliteCopy(withFixture: false): Promise<{ database: Database }>;
export async function openPgliteCopy(withFixture: boolean): Promise<{ database: Database; fixture?: Fixture }> {
  const dir = inject('apiDatabaseSnapshot');
  if (!dir) {
    const database = await openDatabase({ pgliteDir: 'memory://' });
    return withFixture ? { database, fixture: await buildFixture(database.db) } : { database };
  }
  const file = path.join(dir, withFixture ? 'fixture.tar' : 'migrated.tar');
  const database = await openDatabase({ pgliteDir: 'memory://', loadDataDir: new Blob([fs.readFileSync(file)]) });
  if (!withFixture) return { database };
  return { database, fixture: JSON.parse(fs.readFileSync(path.join(dir, 'fixture.json'), 'utf8')) as Fixture };
}
