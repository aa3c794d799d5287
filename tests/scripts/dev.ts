/**
 * `npm run dev`: the API (restarting on change) on :3000 with the development mail sink,
 * the fake weather service on :3099, and the Vite dev server on :5173, which proxies /api
 * to the API. Ctrl-C stops them all.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { repoRoot } from '../../apps/api/src/config.ts';

const children: ChildProcess[] = [];

function run(name: string, command: string, args: string[], env: NodeJS.ProcessEnv = {}) {
  const child = spawn(command, args, { cwd: repoRoot, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
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

// The local stand-in for the hosted weather service, so "pull weather" works offline.
const weatherPort = process.env.FAKE_WEATHER_PORT ?? '3099';
run('weather', process.execPath, ['--import', 'tsx', 'apps/api/src/weather/fake-server.ts'], { FAKE_WEATHER_PORT: weatherPort, WEATHER_API_KEY: 'dev-weather-key' });
run('api', process.execPath, ['--watch-path=apps/api/src', '--watch-path=packages/domain/src', '--import', 'tsx', 'apps/api/src/server.ts'], {
  PORT: process.env.API_PORT ?? '3000',
  // Links in e-mails open the dev server's portal.
  PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://localhost:5173',
  WEATHER_API_URL: process.env.WEATHER_API_URL ?? `http://127.0.0.1:${weatherPort}`,
  WEATHER_API_KEY: process.env.WEATHER_API_KEY ?? 'dev-weather-key',
  LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
});
// Vite lives in the portal workspace (npm does not hoist it), so let npm find it.
run('portal', 'npm', ['run', 'dev', '-w', '@swardwise/portal', '--', '--host', '127.0.0.1']);
