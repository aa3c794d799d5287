/**
 * The API server run as its own process for a check that it refuses to start: it runs until it
 * exits, and one that starts instead is killed after 150 s, so the check fails rather than hangs.
 */
import { spawn } from 'node:child_process';
import { repoRoot } from '../../apps/api/src/config.ts';

/** The server's command line: node with tsx, the way `npm start` runs it. */
export const SERVER_COMMAND: [string, string[]] = [process.execPath, ['--import', 'tsx', 'apps/api/src/server.ts']];

/** Run `command` (the server by default) with `env`; answers its exit code and all it wrote. */
export async function runUntilExit(env: NodeJS.ProcessEnv, [command, args]: [string, string[]] = SERVER_COMMAND): Promise<{ code: number | null; output: string }> {
  const child = spawn(command, args, { cwd: repoRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout.on('data', (d) => (output += d));
  child.stderr.on('data', (d) => (output += d));
  const guard = setTimeout(() => child.kill('SIGKILL'), 150_000);
  const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
  clearTimeout(guard);
  return { code, output };
}
