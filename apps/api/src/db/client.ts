/**
 * Opens the database: embedded PGlite on disk by default, PostgreSQL when DATABASE_URL is
 * set. The same Drizzle schema and migrations serve both; migrations run here, inside the
 * one process that owns the data folder.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { PGlite } from '@electric-sql/pglite';
import { drizzle as drizzlePglite, type PgliteDatabase } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { checkDataFolder } from './data-folder.ts';
import * as schema from './schema/index.ts';

export type Schema = typeof schema;
/** Both drivers expose the same query builder; PGlite's type stands for both. */
export type Db = PgliteDatabase<Schema>;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** A service runs on the database or inside a caller's transaction. */
export type Queryable = Db | Tx;

const migrationsFolder = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/** The advisory lock key the migrations run under on a PostgreSQL server (any fixed number). */
const MIGRATION_LOCK = 7_731_160_416;

export interface Database {
  db: Db;
  kind: 'pglite' | 'postgres';
  close(): Promise<void>;
}

export interface OpenOptions {
  databaseUrl?: string | undefined;
  /** A folder path, or 'memory://' for a throw-away database (tests). */
  pgliteDir?: string;
  /** A data-folder dump to start from (PGlite `loadDataDir`), to skip migrating and seeding. */
  loadDataDir?: Blob | File;
}

export async function openDatabase(options: OpenOptions): Promise<Database> {
  if (options.databaseUrl) {
    const { default: pg } = await import('pg');
    const { drizzle } = await import('drizzle-orm/node-postgres');
    const { migrate } = await import('drizzle-orm/node-postgres/migrator');
    const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 10 });
    // An idle connection the server ends (a restart, an administrator's terminate) is dropped
    // by the pool and the next query opens a new one; unhandled, its error would end the process.
    pool.on('error', () => {});
    // Drizzle's migrator takes no lock: API processes starting together on a new database
    // would each apply the migrations. One session-level advisory lock makes them take turns.
    const client = await pool.connect();
    try {
      await client.query('select pg_advisory_lock($1)', [MIGRATION_LOCK]);
      try {
        await migrate(drizzle(client, { schema }), { migrationsFolder });
      } finally {
        await client.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK]);
      }
    } catch (err) {
      client.release();
      await pool.end();
      throw err;
    }
    client.release();
    const db = drizzle(pool, { schema });
    return { db: db as unknown as Db, kind: 'postgres', close: () => pool.end() };
  }

  const dir = options.pgliteDir ?? './data/pglite';
  if (!dir.startsWith('memory://')) checkDataFolder(dir);
  const client = options.loadDataDir
    ? await PGlite.create({ dataDir: dir, loadDataDir: options.loadDataDir })
    : await PGlite.create(dir);
  const db = drizzlePglite(client, { schema });
  await migratePglite(db, { migrationsFolder });
  return { db, kind: 'pglite', close: () => client.close() };
}
