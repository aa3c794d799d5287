/**
 * An API and portal of its own, in this process, for a browser test that needs what the shared
 * demo server cannot show: the small city of the API tests (its weather ends weeks ago and no
 * weather service answers, so its fields have a weather gap) with its database at hand to set
 * up rows no route writes (e-mail given up). It serves the portal the global setup built.
 */
import crypto from 'node:crypto';
import type { Server } from 'node:http';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { pino } from 'pino';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import type { Mailer } from '../../apps/api/src/mail/mailer.ts';
import type { BackgroundTasks } from '../../apps/api/src/services/background.ts';
import { buildFixture, PASSWORD, type Fixture } from '../support/fixture.ts';
import { freePort } from '../support/postgres-cluster.ts';

export interface OwnServer {
  baseUrl: string;
  database: Database;
  fixture: Fixture;
  background: BackgroundTasks;
  /** Signs in through the real sign-in page as a user of the test city. */
  signIn(page: Page, user: keyof Fixture['users']): Promise<void>;
  close(): Promise<void>;
}

/** An SMTP server that takes every message: what the outbox sends again arrives. */
const acceptingMailer: Mailer = { enabled: true, send: async () => true, deliver: async () => undefined };

export async function startOwnServer(env: Record<string, string> = {}): Promise<OwnServer> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const database = await openDatabase({ pgliteDir: 'memory://' });
  const fixture = await buildFixture(database.db);
  // As the shipped server runs: production, no demo city; a weather service that is down.
  const config = loadConfig({ NODE_ENV: 'production', PUBLIC_URL: baseUrl, PORT: String(port), HOST: '127.0.0.1', WEATHER_API_URL: 'http://127.0.0.1:9/', WEATHER_TIMEOUT_MS: '500', ...env });
  const { app, background } = createApp({ db: database.db, config, logger: pino({ level: 'silent' }), sessionSecret: crypto.randomBytes(32).toString('hex'), mailer: acceptingMailer });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
  return {
    baseUrl,
    database,
    fixture,
    background,
    async signIn(page, user) {
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByLabel('E-mail').fill(fixture.users[user].email);
      await page.getByLabel('Password').fill(PASSWORD);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    },
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await background.idle();
      await database.close();
    },
  };
}

/**
 * The file's own server: started before its tests, closed after them. The object is filled in
 * when the tests start, so read its members inside tests.
 */
export function useOwnServer(env: Record<string, string> = {}): OwnServer {
  const own = {} as OwnServer;
  beforeAll(async () => {
    Object.assign(own, await startOwnServer(env));
  });
  afterAll(() => own.close?.());
  return own;
}
