/**
 * Browser tests run against the real product: the portal is built, and the server starts
 * as `npm start` starts it — production mode with `--demo` — on a free port with a fresh
 * PGlite folder seeded with the demo city.
 */
import { execSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { repoRoot } from '../../apps/api/src/config.ts';
import { startServerProcess } from '../support/server-process.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  if (!process.env.E2E_SKIP_BUILD) {
    // vitest sets NODE_ENV=test, and a build under it is not a production build
    // (import.meta.env.PROD false: no service worker). The portal is built as it ships.
    execSync('npm run build -w @swardwise/portal', { cwd: repoRoot, stdio: 'pipe', env: { ...process.env, NODE_ENV: 'production' } });
  }
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-e2e-'));
  // A server that never answered is killed by startServerProcess; its data folder goes too.
  const server = await startServerProcess({
    args: ['--demo'],
    env: (url) => ({
      // The address the browser opens: the one origin writes are accepted from.
      PUBLIC_URL: url,
      PGLITE_DIR: path.join(dataDir, 'pglite'),
      UPLOADS_DIR: path.join(dataDir, 'uploads'),
      LOG_LEVEL: 'warn',
      LOGIN_ATTEMPTS: '100',
    }),
    // Seeding the demo city on a loaded machine can take minutes: E2E_START_TIMEOUT_MS allows more.
    timeoutMs: Number(process.env.E2E_START_TIMEOUT_MS ?? 90_000),
  }).catch((error: unknown) => {
    fs.rmSync(dataDir, { recursive: true, force: true });
    throw error;
  });
  project.provide('baseUrl', server.url);

  return async () => {
    await server.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
}
