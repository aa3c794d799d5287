/**
 * A fresh API on its own database, for one test file: an in-memory PGlite (project `api`) or
 * a database cloned from a template on the run's PostgreSQL server (project `api-pg`).
 */
import fs from 'node:fs';
import path from 'node:path';
import { pino, type Logger } from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, inject } from 'vitest';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { createMailer, type Mailer } from '../../apps/api/src/mail/mailer.ts';
import type { MailOutbox, OutboxOptions } from '../../apps/api/src/mail/outbox.ts';
import { startMailSink, type MailSink } from '../../apps/api/src/mail/sink.ts';
import type { BackgroundTasks } from '../../apps/api/src/services/background.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { openPgliteCopy } from './db-snapshot.ts';
import { PASSWORD, type Fixture } from './fixture.ts';
import { adminQuery, FIXTURE_TEMPLATE, MIGRATED_TEMPLATE } from './postgres-setup.ts';
import { API_LOG_DIR, TEST_SESSION_SECRET } from './log-scan.ts';

type App = ReturnType<typeof createApp>['app'];

export interface TestApi {
  database: Database;
  app: App;
  fixture: Fixture;
  /** The SMTP sink this API sends its e-mail to. */
  mail: MailSink;
  /** The department clock the API reads "today" from. */
  clock: DepartmentClock;
  /** Work the app finishes after answering (password-reset mail); await `idle()` before checking it. */
  background: BackgroundTasks;
  /** A cookie-keeping client signed in as the fixture user. */
  signIn(user: keyof Fixture['users'], app?: App): Promise<ReturnType<typeof supertest.agent>>;
  /** The same for any account with the fixture password (see `addUser`). */
  signInAs(email: string, app?: App): Promise<ReturnType<typeof supertest.agent>>;
  /**
   * A second app over the same database with other settings (its own rate-limit counters),
   * optionally with its own logger or mailer.
   */
  makeApp(env?: Record<string, string>, extra?: { logger?: Logger; mailer?: Mailer; outbox?: OutboxOptions }): { app: App; background: BackgroundTasks; outbox: MailOutbox };
  close(): Promise<void>;
}

const BASE_ENV = { NODE_ENV: 'test', PUBLIC_URL: 'http://portal.test' };

/** `now`: the server's clock (by default the real one), for tests that stand at a chosen instant. */
export async function startTestApi(env: Record<string, string> = {}, options: { now?: () => Date } = {}): Promise<TestApi> {
  const pg = inject('postgres');
  // PostgreSQL: a clone of the template holding the test city; PGlite: a copy of the run's dump.
  const { database, fixture } = pg ? { database: await openTestDatabase('fixture'), fixture: structuredClone(pg.fixture) } : await openPgliteCopy(true);
  const mail = await startMailSink();
  // The whole run's server log, scanned for secrets when the API tests end (support/log-scan.ts).
  fs.mkdirSync(API_LOG_DIR, { recursive: true });
  const fileLog = pino({ level: 'info' }, pino.destination({ dest: path.join(API_LOG_DIR, `api-${process.pid}.log`), sync: true, append: true }));
  const baseConfig = loadConfig({ ...BASE_ENV, ...env });
  const clock = new DepartmentClock(database.db, baseConfig.departmentTimeZone, options.now);
  let apps = 0;
  const makeApp: TestApi['makeApp'] = (overrides = {}, extra = {}) => {
    // The first app counts sign-ins under the servers' own prefix; each other one on its own.
    const rateLimitPrefix = apps === 0 ? '' : `app${apps}:`;
    apps += 1;
    const config = loadConfig({ ...BASE_ENV, ...overrides });
    const logger = extra.logger ?? fileLog;
    const mailer = extra.mailer ?? createMailer({ host: '127.0.0.1', port: mail.port, secure: false, ignoreTLS: true, from: config.mailFrom }, logger);
    const { app, background, outbox } = createApp({ db: database.db, config, logger, sessionSecret: TEST_SESSION_SECRET, mailer, mailSink: mail, clock, outbox: extra.outbox, rateLimitPrefix });
    return { app, background, outbox };
  };
  const { app, background } = makeApp(env);
  async function signInAs(email: string, target: App = app) {
    const agent = supertest.agent(target);
    const res = await agent.post('/api/auth/sign-in').send({ email, password: PASSWORD });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return agent;
  }
  return {
    database,
    app,
    fixture,
    mail,
    clock,
    background,
    makeApp,
    signIn: (key, target = app) => signInAs(fixture.users[key].email, target),
    signInAs,
    close: async () => {
      await background.idle();
      await mail.close();
      await database.close();
    },
  };
}

/**
 * The file's API: started before its tests, closed after them. The object is filled in when
 * the tests start, so read its members inside tests and hooks, not at the top of the file.
 */
export function useTestApi(env: Record<string, string> = {}, options: { now?: () => Date } = {}): TestApi {
  const api = {} as TestApi;
  beforeAll(async () => {
    Object.assign(api, await startTestApi(env, options));
  });
  afterAll(() => api.close());
  return api;
}

/** An empty in-memory database for the tests around the call (a file or a describe block): opened before them, closed after. */
export function useEmptyDatabase(): Database {
  const database = {} as Database;
  beforeAll(async () => {
    Object.assign(database, await openTestDatabase());
  });
  afterAll(() => database.close());
  return database;
}

let cloned = 0;

/**
 * A database of its own for a test: in-memory PGlite, migrated; or, in the `api-pg` project, a
 * new PostgreSQL database cloned from the migrated template (`'empty'`) or the one holding the
 * test city (`'fixture'`, whose ids are `inject('postgres').fixture`), dropped when closed.
 */
export async function openTestDatabase(template: 'empty' | 'fixture' = 'empty'): Promise<Database> {
  const pg = inject('postgres');
  if (!pg) {
    if (template === 'fixture') throw new Error('the fixture template exists only on PostgreSQL; startTestApi copies the fixture dump on PGlite');
    return (await openPgliteCopy(false)).database;
  }
  const clone = await clonePostgresDatabase(template);
  const database = await openDatabase({ databaseUrl: clone.url });
  return {
    ...database,
    close: async () => {
      await database.close();
      await clone.drop();
    },
  };
}

/** A new database on the run's PostgreSQL server, cloned from a template (`api-pg` only): its URL, and `drop`. */
export async function clonePostgresDatabase(template: 'empty' | 'fixture'): Promise<{ url: string; drop(): Promise<void> }> {
  const pg = inject('postgres');
  if (!pg) throw new Error('no PostgreSQL server in this project (api-pg has one)');
  const name = `t_${process.pid}_${(cloned += 1)}_${Math.random().toString(36).slice(2, 8)}`;
  await adminQuery(pg.baseUrl, `create database ${name} template ${template === 'fixture' ? FIXTURE_TEMPLATE : MIGRATED_TEMPLATE}`);
  return { url: `${pg.baseUrl}/${name}`, drop: () => adminQuery(pg.baseUrl, `drop database if exists ${name} with (force)`) };
}
