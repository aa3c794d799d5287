/**
 * Two API processes behind one PostgreSQL database, as a deployment runs them behind a load
 * balancer: the API keeps no state of its own that matters. A session started on one is good
 * on the other and ends on both, failed sign-ins count across both, and a write on one is in
 * the next (cached) answer of the other. Runs in the `api-pg` project; PGlite is one process.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { repoRoot } from '../../apps/api/src/config.ts';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { clonePostgresDatabase } from '../support/app.ts';
import { PASSWORD } from '../support/fixture.ts';
import { adminQuery } from '../support/postgres-setup.ts';
import { startServerProcess, type ServerProcess } from '../support/server-process.ts';

/**
 * How long another process may still honour a session after sign-out: the user and session
 * caching of the API (if any) must stay within this. Polled, so a process that is already
 * consistent passes at once.
 */
const SIGN_OUT_BOUND_MS = 5_000;
/** Failed sign-ins allowed per account, set on both processes. */
const ATTEMPTS = 4;

const postgres = inject('postgres');

function startServer(databaseUrl: string, dir: string, name: string): Promise<ServerProcess> {
  return startServerProcess({
    env: () => ({
      DEMO: 'false',
      DATABASE_URL: databaseUrl,
      UPLOADS_DIR: path.join(dir, `uploads-${name}`),
      PGLITE_DIR: path.join(dir, `unused-${name}`),
      LOGIN_ATTEMPTS: String(ATTEMPTS),
      LOG_LEVEL: 'warn',
    }),
    unset: ['SESSION_SECRET', 'SMTP_HOST', 'ADMIN_EMAIL', 'ADMIN_PASSWORD', 'PUBLIC_URL', 'TRUST_PROXY'],
    name: `API process ${name}`,
  });
}

/** A JSON request; `cookie` is sent as is. */
async function call(base: string, method: string, url: string, body?: unknown, cookie?: string) {
  const res = await fetch(`${base}${url}`, {
    method,
    headers: { ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...(cookie ? { cookie } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- answers of many shapes, checked by the assertions
  return { status: res.status, body: (text ? JSON.parse(text) : {}) as Record<string, any>, cookie: res.headers.getSetCookie().map((c) => c.split(';')[0]!).join('; ') };
}

describe.skipIf(!postgres)('two API processes on one PostgreSQL database', () => {
  let a: ServerProcess;
  let b: ServerProcess;
  let dir: string;
  let drop: () => Promise<void>;

  beforeAll(async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-two-'));
    const clone = await clonePostgresDatabase('fixture');
    drop = clone.drop;
    [a, b] = await Promise.all([startServer(clone.url, dir, 'a'), startServer(clone.url, dir, 'b')]);
  }, 120_000);
  afterAll(async () => {
    await Promise.all([a?.stop(), b?.stop()]);
    await drop?.();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  const users = () => postgres.fixture.users;

  test('should honour a session started on one process on the other, and end it on both', async () => {
    const signIn = await call(a.url, 'POST', '/api/auth/sign-in', { email: users().head.email, password: PASSWORD });
    expect(signIn.status, a.output()).toBe(200);
    const cookie = signIn.cookie;
    expect(cookie).toMatch(/^swardwise\.sid=/);
    expect((await call(b.url, 'GET', '/api/auth/me', undefined, cookie)).body.user.email).toBe(users().head.email);

    expect((await call(b.url, 'POST', '/api/auth/sign-out', {}, cookie)).status).toBe(204);
    expect((await call(b.url, 'GET', '/api/auth/me', undefined, cookie)).status).toBe(401);
    // The other process refuses the cookie too, within the stated bound.
    const since = Date.now();
    let status = 0;
    while ((status = (await call(a.url, 'GET', '/api/auth/me', undefined, cookie)).status) !== 401 && Date.now() - since < SIGN_OUT_BOUND_MS) {
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(status).toBe(401);
  });

  test('should count failed sign-ins for an account across both processes', async () => {
    const email = users().crew.email;
    const statuses: number[] = [];
    // Alternating: each process alone has seen only half the attempts.
    for (let i = 0; i < ATTEMPTS + 1; i += 1) {
      statuses.push((await call(i % 2 === 0 ? a.url : b.url, 'POST', '/api/auth/sign-in', { email, password: 'guess-guess' })).status);
    }
    expect(statuses).toEqual([...Array<number>(ATTEMPTS).fill(401), 429]);
    // Locked on both, even with the right password.
    expect((await call(b.url, 'POST', '/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(429);
    expect((await call(a.url, 'POST', '/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(429);
  });

  test('should show a write on one process in the next answer of the other, cached or not', async () => {
    const cookieA = (await call(a.url, 'POST', '/api/auth/sign-in', { email: users().admin.email, password: PASSWORD })).cookie;
    const cookieB = (await call(b.url, 'POST', '/api/auth/sign-in', { email: users().admin.email, password: PASSWORD })).cookie;
    const fieldId = postgres.fixture.fields.northSoccer;
    const listed = async (base: string, cookie: string) =>
      ((await call(base, 'GET', '/api/fields', undefined, cookie)).body.items as { id: number; name: string; version: number }[]).find((f) => f.id === fieldId)!;
    // Both processes hold the field list in their answer caches.
    const before = await listed(b.url, cookieB);
    expect(await listed(b.url, cookieB)).toEqual(before);
    expect(await listed(a.url, cookieA)).toEqual(before);

    const renamed = await call(a.url, 'PATCH', `/api/fields/${fieldId}`, { version: before.version, name: 'Renamed on process A' }, cookieA);
    expect(renamed.status, JSON.stringify(renamed.body)).toBe(200);
    expect(await listed(b.url, cookieB)).toMatchObject({ name: 'Renamed on process A', version: before.version + 1 });
    // The version check holds across processes: B's stale write is a conflict.
    const stale = await call(b.url, 'PATCH', `/api/fields/${fieldId}`, { version: before.version, name: 'Stale on B' }, cookieB);
    expect(stale.status).toBe(409);
  });

  test('should migrate a new database once when processes start on it together', async () => {
    const name = `fresh_${process.pid}_${Date.now()}`;
    await adminQuery(postgres.baseUrl, `create database ${name}`);
    try {
      const opened = await Promise.all([1, 2, 3].map(() => openDatabase({ databaseUrl: `${postgres.baseUrl}/${name}` })));
      const { rows } = await opened[0]!.db.execute('select count(*)::int as n from drizzle.__drizzle_migrations');
      const journal = JSON.parse(fs.readFileSync(path.join(repoRoot, 'apps/api/src/db/migrations/meta/_journal.json'), 'utf8')) as { entries: unknown[] };
      expect((rows[0] as { n: number }).n).toBe(journal.entries.length);
      await Promise.all(opened.map((d) => d.close()));
    } finally {
      await adminQuery(postgres.baseUrl, `drop database if exists ${name} with (force)`);
    }
  });
});
