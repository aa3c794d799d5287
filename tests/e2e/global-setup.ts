/**
 * Browser tests run against the real product: the portal is built, and the server starts
 * as `npm start` starts it — production mode with `--demo` — on a free port with a fresh
 * PGlite folder seeded with the demo city.
 */
import { execSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { repoRoot } from '../../apps/api/src/config.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

async function waitForHealth(url: string, child: ChildProcess, log: () => string, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}:\n${log()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`server did not become healthy in ${timeoutMs} ms:\n${log()}`);
}

export default async function setup(project: TestProject) {
  if (!process.env.E2E_SKIP_BUILD) {
    // vitest sets NODE_ENV=test, and a build under it is not a production build
    // (import.meta.env.PROD false: no service worker). The portal is built as it ships.
    execSync('npm run build -w @swardwise/portal', { cwd: repoRoot, stdio: 'pipe', env: { ...process.env, NODE_ENV: 'production' } });
  }
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-e2e-'));
  const port = await freePort();
  let output = '';
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'apps/api/src/server.ts', '--demo'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      // The address the browser opens: the one origin writes are accepted from.
      PUBLIC_URL: baseUrl,
      PGLITE_DIR: path.join(dataDir, 'pglite'),
      UPLOADS_DIR: path.join(dataDir, 'uploads'),
      LOG_LEVEL: 'warn',
      LOGIN_ATTEMPTS: '100',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  // Seeding the demo city on a loaded machine can take minutes: E2E_START_TIMEOUT_MS allows more.
  await waitForHealth(baseUrl, child, () => output, Number(process.env.E2E_START_TIMEOUT_MS ?? 90_000));
  project.provide('baseUrl', baseUrl);

  return async () => {
    child.kill('SIGTERM');
    await new Promise((r) => child.once('exit', r));
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
}
