/**
 * The API server as its own process, started the way `npm start` starts it, on a free loopback
 * port, for checks that need a real process: one to kill, two behind one database, the
 * browser tests' server. Answers once `/api/health` does; a process that exits first, or does
 * not answer in time, fails with everything it wrote.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { repoRoot } from '../../apps/api/src/config.ts';
import { freePort } from './postgres-cluster.ts';
import { SERVER_COMMAND } from './server-exit.ts';

export interface ServerProcess {
  /** `http://127.0.0.1:<port>`. */
  url: string;
  child: ChildProcess;
  /** Everything the process wrote so far, stdout and stderr together. */
  output(): string;
  /** SIGTERM, and waits for the exit (at once when it has exited already). */
  stop(): Promise<void>;
}

export interface ServerProcessOptions {
  /** Variables over the test run's own and production mode; `url` is the address it will answer on. */
  env: (url: string) => NodeJS.ProcessEnv;
  /** Variables of the run's environment the process must not see. */
  unset?: string[];
  /** More arguments for the server (`--demo`). */
  args?: string[];
  /** Named in the errors, for a check that starts more than one. */
  name?: string;
  timeoutMs?: number;
}

export async function startServerProcess({ env, unset = [], args = [], name = 'server', timeoutMs = 90_000 }: ServerProcessOptions): Promise<ServerProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const childEnv: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', PORT: String(port), HOST: '127.0.0.1', ...env(url) };
  for (const key of unset) delete childEnv[key];
  const [command, serverArgs] = SERVER_COMMAND;
  const child = spawn(command, [...serverArgs, ...args], { cwd: repoRoot, env: childEnv, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  const stop = () =>
    new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once('exit', () => resolve());
      child.kill('SIGTERM');
    });
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`${name} exited with ${child.exitCode}:\n${output}`);
    if (await fetch(`${url}/api/health`).then((r) => r.ok, () => false)) return { url, child, output: () => output, stop };
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill('SIGKILL');
  throw new Error(`${name} did not answer within ${timeoutMs / 1000} s:\n${output}`);
}
