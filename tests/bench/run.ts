/**
 * `npm run bench`: every benchmark script in this folder (not `support.ts`, their shared
 * helpers), one after another, each in its own process so one does not warm or load the
 * next. `npm run bench -- map` runs one.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const dir = import.meta.dirname;
const only = process.argv.slice(2);
const scripts = fs
  .readdirSync(dir)
  .filter((f) => f.endsWith('.ts') && f !== 'run.ts' && f !== 'support.ts' && !f.endsWith('.d.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.startsWith(o)))
  .sort();

let failed = 0;
for (const script of scripts) {
  console.log(`\n=== ${script}`);
  const res = spawnSync(process.execPath, ['--import', 'tsx', path.join(dir, script)], { stdio: 'inherit' });
  if (res.status !== 0) {
    failed += 1;
    console.error(`${script} exited with ${res.status}`);
  }
}
process.exit(failed ? 1 : 0);
