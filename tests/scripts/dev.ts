/**
 * `npm run dev`: the API (restarting on change) on :3000 and the Vite dev server on :5173,
 * which proxies /api to it. Ctrl-C stops both.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { repoRoot } from '../../apps/api/src/config.ts';

const children: ChildProcess[] = [];

function run(name: string, args: string[], env: NodeJS.ProcessEnv = {}) {
  const child = spawn(process.execPath, args, { cwd: repoRoot, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  const prefix = (chunk: Buffer) =>
    chunk
      .toString()
      .split('\n')
      .filter(Boolean)
      .map((line) => `[${name}] ${line}`)
      .join('\n');
  child.stdout!.on('data', (d: Buffer) => console.log(prefix(d)));
  child.stderr!.on('data', (d: Buffer) => console.error(prefix(d)));
  child.on('exit', (code) => {
    console.log(`[${name}] exited with ${code}`);
    stop();
  });
  children.push(child);
}

function stop() {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  setTimeout(() => process.exit(0), 500).unref();
}

process.on('SIGINT', stop);
process.on('SIGTERM', stop);

run('api', ['--watch-path=apps/api/src', '--watch-path=packages/domain/src', '--import', 'tsx', 'apps/api/src/server.ts'], {
  PORT: process.env.API_PORT ?? '3000',
  LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
});
run('portal', ['node_modules/vite/bin/vite.js', '--config', 'apps/portal/vite.config.ts', '--host', '127.0.0.1']);
