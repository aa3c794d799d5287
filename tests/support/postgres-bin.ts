/**
 * Where the PostgreSQL server programs are (Debian's `postgresql` package puts them in
 * /usr/lib/postgresql/<major>/bin, outside PATH). Plain Node: vite.config.ts reads it too.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

/** The folder holding `initdb`, `pg_ctl` and `pg_dump`: PG_BIN, the newest Debian install, or PATH; null when there is none. */
export function postgresBinDir(env: NodeJS.ProcessEnv = process.env): string | null {
  const has = (dir: string) => ['initdb', 'pg_ctl', 'postgres'].every((p) => fs.existsSync(path.join(dir, p)));
  if (env.PG_BIN) return has(env.PG_BIN) ? env.PG_BIN : null;
  const debian = '/usr/lib/postgresql';
  if (fs.existsSync(debian)) {
    const majors = fs.readdirSync(debian).filter((d) => /^\d+$/.test(d)).sort((a, b) => Number(b) - Number(a));
    for (const m of majors) if (has(path.join(debian, m, 'bin'))) return path.join(debian, m, 'bin');
  }
  try {
    const initdb = execFileSync('sh', ['-c', 'command -v initdb'], { encoding: 'utf8' }).trim();
    const dir = initdb ? path.dirname(fs.realpathSync(initdb)) : '';
    return dir && has(dir) ? dir : null;
  } catch {
    return null;
  }
}
