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
  countWrites(db, client);
  return { db, kind: 'pglite', close: () => client.close() };
}

/** Per PGlite database: statements sent that may have written (see `localWriteCount`). */
const writeCounters = new WeakMap<object, { n: number }>();

/**
 * Statements that only read: a select (a data-changing CTE aside), and the transaction
 * brackets around others, which are counted themselves. `for update` and the like count as
 * writes: an extra count costs a cache miss, a missing one a stale answer.
 */
const READ_ONLY = /^\s*(select|show|begin|start transaction|commit|end|rollback|savepoint|release|set)\b/i;
const WRITE_WORD = /\b(insert|update|delete|truncate|merge|copy|alter|create|drop|refresh|call|do)\b/i;
/**
 * Tables written on their own all day (a session's expiry, sign-in counters, the outbox's
 * passes, audit entries beside a counted write) that no cached answer reads and whose rows no
 * answer's table references: writing only these leaves cached answers current.
 */
const UNCOUNTED = new Set(['sessions', 'rate_limits', 'mail_outbox', 'audit_log']);
const TARGET = /^\s*(?:insert\s+into|update|delete\s+from)\s+"?([a-z_]+)"?/i;
function mayWrite(query: unknown): boolean {
  if (typeof query !== 'string') return true;
  const target = TARGET.exec(query)?.[1];
  if (target && UNCOUNTED.has(target.toLowerCase())) return false;
  if (/^\s*with\b/i.test(query)) return WRITE_WORD.test(query);
  return !READ_ONLY.test(query) || (/^\s*select\b/i.test(query) && /\bfor\s+(no\s+key\s+)?update\b/i.test(query));
}

/**
 * A PGlite database lives in this one process (its folder is never opened by two), so every
 * write reaches it through this client: counting them here tells the answer cache that its
 * answers are current without a query per request. Counted when the statement is sent and
 * again when it ends, so a read that begins after a write has ended always sees a new count.
 */
function countWrites(db: object, client: PGlite): void {
  const counter = { n: 0 };
  writeCounters.set(db, counter);
  type Run = (query: string, ...rest: unknown[]) => Promise<unknown>;
  const wrap = <T extends object>(target: T, method: 'query' | 'exec' | 'sql') => {
    const original = (target as Record<string, unknown>)[method];
    if (typeof original !== 'function') return;
    (target as Record<string, unknown>)[method] = function (this: unknown, query: string, ...rest: unknown[]) {
      if (!mayWrite(query)) return (original as Run).call(target, query, ...rest);
      counter.n += 1;
      const done = (original as Run).call(target, query, ...rest);
      const after = () => {
        counter.n += 1;
      };
      done.then(after, after);
      return done;
    };
  };
  wrap(client, 'query');
  wrap(client, 'exec');
  const transaction = client.transaction.bind(client);
  client.transaction = ((run: (tx: Parameters<Parameters<PGlite['transaction']>[0]>[0]) => Promise<unknown>) =>
    transaction(async (tx) => {
      wrap(tx, 'query');
      wrap(tx, 'exec');
      return run(tx);
    }).finally(() => {
      // The commit (or rollback) itself: what the transaction wrote is visible from here.
      counter.n += 1;
    })) as PGlite['transaction'];
}

/**
 * How many statements that may have written this process has sent to its PGlite database, or
 * undefined on PostgreSQL, where other processes write too (ask the database instead).
 */
export function localWriteCount(db: object): number | undefined {
  return writeCounters.get(db)?.n;
}
