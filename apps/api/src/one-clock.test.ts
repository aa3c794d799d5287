/**
 * One clock: "today", the week and the date of a moment are the department's local dates,
 * taken from the department clock (`ctx.clock` in the API, `useToday()` / the session store in
 * the portal). This check reads the source of apps/ and packages/ (tests aside) and fails on a
 * calendar date taken from an instant in UTC, or in the machine's own zone.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';

const root = path.resolve(import.meta.dirname, '../../..');

const PATTERNS: Array<{ re: RegExp; what: string }> = [
  { re: /new Date\(\)\.(toISOString|toJSON)\(\)\.(slice|substring|substr|split)\(/, what: 'the UTC date of now' },
  { re: /Date\.now\(\)[^;]*\)\.(toISOString|toJSON)\(\)\.(slice|substring|substr|split)\(/, what: 'the UTC date of a moment from now' },
  { re: /new Date\(\)\.getUTC(FullYear|Month|Date|Day)\(\)/, what: 'the UTC calendar of now' },
  // A Date built from a template literal is an ISO date at UTC midnight or noon: calendar arithmetic, fine.
  { re: /new Date\([^`)]+\)\.(toISOString|toJSON)\(\)\.(slice|substring|substr|split)\(/, what: 'the UTC date of an instant' },
  { re: /\.(toISOString|toJSON)\(\)\.(slice\(0, ?10\)|substring\(0, ?10\)|substr\(0, ?10\)|split\(['"]T['"]\))/, what: 'the UTC date of an instant' },
  { re: /new Date\(\)\.(getFullYear|getMonth|getDate|getDay)\(\)/, what: 'the machine’s own calendar of now' },
  { re: /new Date\(\)\.toLocale(Date)?String\((?![^)]*timeZone)/, what: 'the machine’s own date of now' },
];

/** Lines that match a pattern on a date that is no instant, each with its reason. */
const ALLOWED: Array<{ file: string; text: string; why: string }> = [
  { file: 'apps/api/src/db/seed/demo-weather.ts', text: 'date: date.toISOString().slice(0, 10)', why: 'the season’s dates are built at UTC midnight' },
];

function sourceFiles(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (['node_modules', 'dist', 'migrations', 'coverage'].includes(entry.name) || entry.name.startsWith('.')) continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) sourceFiles(full, out);
    else if (/\.(ts|vue|js|mjs)$/.test(entry.name) && !/\.(test|d)\.ts$/.test(entry.name)) out.push(full);
  }
  return out;
}

function offences(file: string, text: string): string[] {
  const rel = path.relative(root, file);
  const found: string[] = [];
  text.split('\n').forEach((line, i) => {
    const hit = PATTERNS.find((p) => p.re.test(line));
    if (hit && !ALLOWED.some((a) => a.file === rel && line.includes(a.text))) found.push(`${rel}:${i + 1} ${hit.what}: ${line.trim()}`);
  });
  return found;
}

describe('one clock', () => {
  test('should recognise the ways a UTC or machine-local "today" has been written', () => {
    const bad = [
      'const today = () => new Date().toISOString().slice(0, 10);',
      "const today = new Date().toISOString().split('T')[0];",
      'const to = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);',
      'const doneOn = r.doneAt ? new Date(r.doneAt).toISOString().slice(0, 10) : null;',
      'const date = new Date(t).toISOString().slice(0, 10);',
      'const reportedOn = reportedAt.toISOString().slice(0, 10);',
      'const sunday = new Date().getUTCDay() === 0;',
      'const year = new Date().getFullYear();',
      "const subtitle = new Date().toLocaleDateString('en-US', { weekday: 'long' });",
    ];
    for (const line of bad) expect(offences(path.join(root, 'apps/x.ts'), line), line).toHaveLength(1);
    const fine = [
      'const today = ctx.clock.today();',
      "const d = new Date(`${iso}T00:00:00Z`).toISOString().startsWith(iso);",
      "const label = new Date(`${today}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', timeZone: 'UTC' });",
      'queuedAt: new Date().toISOString(),',
    ];
    for (const line of fine) expect(offences(path.join(root, 'apps/x.ts'), line), line).toEqual([]);
  });

  test('should find no "today" taken as a UTC or machine-local date in apps/ and packages/', () => {
    const files = [...sourceFiles(path.join(root, 'apps')), ...sourceFiles(path.join(root, 'packages'))];
    expect(files.length).toBeGreaterThan(100);
    const found = files.flatMap((f) => offences(f, fs.readFileSync(f, 'utf8')));
    expect(found).toEqual([]);
  });
});
