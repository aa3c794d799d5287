/**
 * kill -9 in the middle of a burst of writes on embedded PGlite: every write the server
 * acknowledged (a 201 with the new row's id) is there after the kill, and the data folder
 * opens cleanly, at several moments of the burst.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inArray, sql } from 'drizzle-orm';
import { afterAll, describe, expect, test } from 'vitest';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { users } from '../../apps/api/src/db/schema/index.ts';
import { startServerProcess, type ServerProcess } from '../support/server-process.ts';

const ADMIN = { email: 'kill.admin@test.example', password: 'a-long-admin-password' };
/** The moments of the kills: after this many acknowledged writes (more are in flight). */
const KILL_AFTER_ACKS = [1, 10, 30];
/** Writes in flight at once. */
const IN_FLIGHT = 4;

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-kill-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function startServer() {
  return startServerProcess({
    env: () => ({
      PGLITE_DIR: path.join(dir, 'pglite'),
      UPLOADS_DIR: path.join(dir, 'uploads'),
      ADMIN_EMAIL: ADMIN.email,
      ADMIN_PASSWORD: ADMIN.password,
      SESSION_SECRET: 'kill-nine-test-session-secret-0123456789',
      LOG_LEVEL: 'warn',
    }),
    unset: ['DEMO', 'SEED_DEMO', 'DATABASE_URL', 'SMTP_HOST'],
    timeoutMs: 120_000,
  });
}

async function signIn(url: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(ADMIN) });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

interface Round {
  killAfterAcks: number;
  acknowledged: string[];
  found: number;
  committed: number;
  msPerWrite: number;
}

/** Invites people as fast as `IN_FLIGHT` requests allow until the server dies; returns the addresses it acknowledged. */
async function burstUntilKilled(server: ServerProcess, round: number, killAfterAcks: number) {
  const cookie = await signIn(server.url);
  const acknowledged: string[] = [];
  const times: number[] = [];
  let n = 0;
  let killed = false;
  let enough: () => void;
  const acked = new Promise<void>((r) => (enough = r));
  const exited = new Promise<void>((r) => server.child.once('exit', () => r()));
  const worker = async () => {
    while (!killed) {
      const email = `r${round}.w${n++}@test.example`;
      const started = performance.now();
      try {
        const res = await fetch(`${server.url}/api/users`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify({ email, name: `Burst ${email}`, role: 'head' }) });
        const body = (await res.json()) as { user?: { id: number; email: string } };
        if (res.status === 201 && body.user?.id && body.user.email === email) {
          acknowledged.push(email);
          times.push(performance.now() - started);
          if (acknowledged.length === killAfterAcks) enough();
        }
      } catch {
        // the connection died with the server: not acknowledged
      }
    }
  };
  const workers = Array.from({ length: IN_FLIGHT }, worker);
  await acked;
  server.child.kill('SIGKILL');
  await exited;
  killed = true;
  await Promise.all(workers);
  return { acknowledged, msPerWrite: times.reduce((a, b) => a + b, 0) / Math.max(1, times.length) };
}

describe('kill -9 during a burst of writes', () => {
  test('should keep every acknowledged write and open cleanly after each kill', async () => {
    const rounds: Round[] = [];
    for (const [i, killAfterAcks] of KILL_AFTER_ACKS.entries()) {
      // Each round after the first restarts the server on the folder the previous kill left.
      const server = await startServer();
      const { acknowledged, msPerWrite } = await burstUntilKilled(server, i, killAfterAcks);
      // The folder opens in this process (migrations run, recovery included) and holds every acknowledged row.
      const database = await openDatabase({ pgliteDir: path.join(dir, 'pglite') });
      try {
        const found = acknowledged.length ? await database.db.select({ email: users.email }).from(users).where(inArray(users.email, acknowledged)) : [];
        // Writes committed whose answer the kill cut off are there too; they were never promised.
        const [{ n: committed }] = (await database.db.execute(sql`select count(*)::int as n from users where email like ${`r${i}.w%`}`)).rows as [{ n: number }];
        rounds.push({ killAfterAcks, acknowledged, found: found.length, committed, msPerWrite });
        expect(found.map((r) => r.email).sort()).toEqual([...acknowledged].sort());
      } finally {
        await database.close();
      }
    }
    console.info(`kill -9 rounds: ${rounds.map((r) => `killed after ${r.killAfterAcks} answers: ${r.acknowledged.length} acknowledged, ${r.found} found, ${r.committed} committed (${r.msPerWrite.toFixed(1)} ms a write)`).join('; ')}`);
    expect(rounds.map((r) => r.acknowledged.length >= r.killAfterAcks)).toEqual(KILL_AFTER_ACKS.map(() => true));
  }, 300_000);
});
