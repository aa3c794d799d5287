/**
 * What a start does with a new database: demo mode seeds and announces the invented city;
 * production without it creates the first administrator from ADMIN_EMAIL / ADMIN_PASSWORD,
 * or refuses to start.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Writable } from 'node:stream';
import { pino } from 'pino';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig, repoRoot } from '../../apps/api/src/config.ts';
import type { Database } from '../../apps/api/src/db/client.ts';
import { districts, settings, users } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { prepareInstallation, StartupError } from '../../apps/api/src/services/first-run.ts';
import { useEmptyDatabase } from '../support/app.ts';
import { runUntilExit } from '../support/server-exit.ts';

/** A logger whose lines are kept, and a printer for the one-time link. */
function capture() {
  const lines: string[] = [];
  const printed: string[] = [];
  const logger = pino(
    { level: 'info' },
    new Writable({
      write(chunk, _enc, cb) {
        lines.push(String(chunk));
        cb();
      },
    }),
  );
  return { logger, lines, printed, print: (line: string) => printed.push(line) };
}

const PRODUCTION = { production: true, demo: false, adminEmail: undefined, adminPassword: undefined, publicUrl: 'https://parks.example.org' };
const appOver = (database: Database, env: Record<string, string> = {}) =>
  createApp({ db: database.db, config: loadConfig({ NODE_ENV: 'production', PUBLIC_URL: 'https://parks.example.org', ...env }), logger: pino({ level: 'silent' }), sessionSecret: 'first-run' }).app;

describe('demo mode setting', () => {
  test('should be off in production unless asked for, on in development, and asked for by npm start', () => {
    expect(loadConfig({ NODE_ENV: 'production' }).demo).toBe(false);
    expect(loadConfig({ NODE_ENV: 'production' }, ['--demo']).demo).toBe(true);
    expect(loadConfig({ NODE_ENV: 'production', DEMO: 'true' }).demo).toBe(true);
    expect(loadConfig({ NODE_ENV: 'production', SEED_DEMO: 'true' }).demo).toBe(true);
    expect(loadConfig({ NODE_ENV: 'development' }).demo).toBe(true);
    expect(loadConfig({ NODE_ENV: 'development', DEMO: 'false' }).demo).toBe(false);
    const scripts = (JSON.parse(fs.readFileSync(path.join(repoRoot, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts;
    expect(scripts.start).toContain('--demo');
    expect(scripts.serve).not.toContain('--demo');
  });
});

describe('a new production database', () => {
  const database = useEmptyDatabase();

  test('should refuse to start with neither the demo nor ADMIN_EMAIL, and write nothing', async () => {
    const { logger } = capture();
    const start = prepareInstallation(database.db, PRODUCTION, logger);
    await expect(start).rejects.toThrow(StartupError);
    await expect(start).rejects.toThrow(/ADMIN_EMAIL and ADMIN_PASSWORD/);
    expect(await database.db.select().from(users)).toHaveLength(0);
    expect(await database.db.select().from(districts)).toHaveLength(0);
  });

  test('should refuse an ADMIN_PASSWORD shorter than 12 characters and an ADMIN_EMAIL that is not one', async () => {
    const { logger } = capture();
    await expect(prepareInstallation(database.db, { ...PRODUCTION, adminEmail: 'chief@parks.example.org', adminPassword: 'eleven-char' }, logger)).rejects.toThrow(/ADMIN_PASSWORD: use at least 12 characters/);
    await expect(prepareInstallation(database.db, { ...PRODUCTION, adminEmail: 'not an address', adminPassword: 'long-enough-password' }, logger)).rejects.toThrow(/ADMIN_EMAIL/);
    expect(await database.db.select().from(users)).toHaveLength(0);
  });

  test('should create exactly one administrator from ADMIN_EMAIL and ADMIN_PASSWORD, and no demo users', async () => {
    const { logger, lines } = capture();
    const config = { ...PRODUCTION, adminEmail: ' Chief@Parks.example.org ', adminPassword: 'first-admin-password' };
    await prepareInstallation(database.db, config, logger);
    // A second start with the same settings changes nothing.
    await prepareInstallation(database.db, config, logger);
    const all = await database.db.select().from(users);
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({ email: 'chief@parks.example.org', role: 'admin', active: true, districtId: null });
    expect(await database.db.select().from(districts)).toHaveLength(0);
    expect(await database.db.select().from(settings)).not.toContainEqual(expect.objectContaining({ key: 'demo_city' }));
    expect(lines.join('')).not.toContain('first-admin-password');

    const app = appOver(database);
    const signIn = await supertest(app).post('/api/auth/sign-in').send({ email: 'chief@parks.example.org', password: 'first-admin-password' });
    expect(signIn.status).toBe(200);
    expect(signIn.body.user.role).toBe('admin');
    for (const role of ['admin', 'head'] as const) {
      const demo = await supertest(app).post('/api/auth/sign-in').send(DEMO_SIGN_INS[role]);
      expect(demo.status, role).toBe(401);
    }
    expect((await supertest(app).get('/api/config')).body).toEqual({ demo: null });
  });
});

describe('a new production database with ADMIN_EMAIL alone', () => {
  const database = useEmptyDatabase();

  test('should print a one-time setup link (not into the log) that sets the administrator’s password', async () => {
    const { logger, lines, printed } = capture();
    const print = (line: string) => printed.push(line);
    await prepareInstallation(database.db, { ...PRODUCTION, adminEmail: 'chief@parks.example.org' }, logger, print);
    expect(printed).toHaveLength(1);
    const link = printed[0]!.match(/https:\/\/parks\.example\.org\/accept-invite\?token=(\S+)/);
    expect(link).not.toBeNull();
    const token = link![1]!;
    expect(lines.join('')).not.toContain(token);

    // Until the link is used, every start gives a new one and the old one stops working.
    await prepareInstallation(database.db, { ...PRODUCTION, adminEmail: 'chief@parks.example.org' }, logger, print);
    expect(printed).toHaveLength(2);
    const newer = printed[1]!.match(/token=(\S+)/)![1]!;
    const app = appOver(database);
    expect((await supertest(app).post('/api/auth/accept-invite').send({ token, password: 'a-good-admin-password' })).status).toBe(400);
    const accepted = await supertest(app).post('/api/auth/accept-invite').send({ token: newer, password: 'a-good-admin-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ email: 'chief@parks.example.org', role: 'admin' });

    // Once someone can sign in, a start neither prints nor changes anything.
    await prepareInstallation(database.db, { ...PRODUCTION, adminEmail: 'chief@parks.example.org' }, logger, print);
    expect(printed).toHaveLength(2);
    expect(await database.db.select().from(users)).toHaveLength(1);
  });
});

describe('demo mode', () => {
  const database = useEmptyDatabase();

  test('should seed the demo city, say so in the log and on the public config answer', async () => {
    const { logger, lines } = capture();
    await prepareInstallation(database.db, { ...PRODUCTION, demo: true }, logger);
    expect(await database.db.select().from(districts)).toHaveLength(3);
    const log = lines.join('');
    expect(log).toContain('demo city seeded (invented data)');
    expect(log).toContain('DEMO MODE');

    const res = await supertest(appOver(database, { DEMO: 'true' })).get('/api/config');
    expect(res.status).toBe(200);
    expect(res.body.demo).toMatchObject({ city: 'Sallowmere' });
    expect(res.body.demo.note).toMatch(/Invented demo city/);
    expect(res.body.demo.signIns).toContainEqual({ role: 'head', label: 'Department head', ...DEMO_SIGN_INS.head });
    const signIn = await supertest(appOver(database, { DEMO: 'true' })).post('/api/auth/sign-in').send(DEMO_SIGN_INS.admin);
    expect(signIn.status).toBe(200);
  });

  test('should refuse to serve the demo database in production outside demo mode', async () => {
    const { logger } = capture();
    await expect(prepareInstallation(database.db, PRODUCTION, logger)).rejects.toThrow(/holds the invented demo city/);
    expect((await supertest(appOver(database)).get('/api/config')).body).toEqual({ demo: null });
  });
});

describe('the server process', () => {
  test('should exit with status 1 and a clear message on a new production database without admin settings', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-first-run-'));
    try {
      const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', PORT: '0', HOST: '127.0.0.1', PGLITE_DIR: path.join(dir, 'pglite'), UPLOADS_DIR: path.join(dir, 'uploads'), LOG_LEVEL: 'warn' };
      for (const name of ['DEMO', 'SEED_DEMO', 'ADMIN_EMAIL', 'ADMIN_PASSWORD', 'DATABASE_URL']) delete env[name];
      const { code, output } = await runUntilExit(env);
      expect(code).toBe(1);
      expect(output).toContain('Swardwise cannot start: This is a new installation and nobody can sign in yet.');
      expect(output).not.toMatch(/at prepareInstallation/);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 180_000);
});
