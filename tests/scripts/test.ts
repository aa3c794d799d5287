/**
 * `npm test`: every vitest project, as two `vitest run` side by side.
 *
 * - The browser tests (`e2e`), one file at a time. They mostly wait: for the page to settle,
 *   for the network to go quiet, for the server's answer (their two longest files used 91 s
 *   of processor time in 360 s). Run last, after every other project, they left a core idle
 *   for the ten minutes they take.
 * - Every other project (unit, reference, portal, then the API tests on PGlite and on
 *   PostgreSQL, two workers each) in its own run, filling the cores meanwhile.
 *
 * The lines of each run come as they are written, marked with the run's name; each ends with
 * its own summary, and `npm test` fails when either fails. With arguments it is one
 * `vitest run` with them, as before: `npm test -- --project api`.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { postgresBinDir } from '../support/postgres-bin.ts';

const root = path.resolve(import.meta.dirname, '../..');
const vitest = path.join(root, 'node_modules/.bin/vitest');
const children = new Set<ReturnType<typeof spawn>>();

// Passed on, and waited for: each run stops its servers and PostgreSQL cluster as it ends.
// A second signal leaves at once.
let stopping = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (stopping) process.exit(130);
    stopping = true;
    for (const child of children) child.kill(signal);
  });
}

/** One `vitest run`; each line of its output is written as it comes, after `label` when given. */
function run(args: string[], label?: string): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(vitest, ['run', ...args], { cwd: root, stdio: label ? ['ignore', 'pipe', 'pipe'] : 'inherit' });
    children.add(child);
    for (const [from, to] of [[child.stdout, process.stdout], [child.stderr, process.stderr]] as const) {
      let rest = '';
      from?.on('data', (d) => {
        const lines = (rest + d).split('\n');
        rest = lines.pop()!;
        for (const line of lines) to.write(`${label} ${line}\n`);
      });
      from?.on('end', () => rest && to.write(`${label} ${rest}\n`));
    }
    child.on('close', (code, signal) => {
      children.delete(child);
      resolve(code ?? (signal ? 1 : 0));
    });
  });
}

const args = process.argv.slice(2);
if (args.length) process.exit(await run(args));

const started = Date.now();
const projects = (...names: string[]) => names.flatMap((n) => ['--project', n]);
// Without PostgreSQL programs vite.config.ts leaves api-pg out (and fails the run under CI).
const rest = ['domain', 'reference', 'api-unit', 'portal', 'api', ...(postgresBinDir() ? ['api-pg'] : [])];
// Two workers for the unit and portal projects too (vitest's default leaves one core to itself).
const [browser, others] = await Promise.all([run(projects('e2e'), '[e2e]'), run([...projects(...rest), '--maxWorkers', '2'], '[rest]')]);
const failed = [browser && 'browser (e2e)', others && rest.join(', ')].filter(Boolean);
console.log(`\nnpm test: ${Math.round((Date.now() - started) / 1000)} s; ${failed.length ? `FAILED: ${failed.join('; ')}` : 'every project passed'}`);
process.exit(failed.length ? 1 : 0);
