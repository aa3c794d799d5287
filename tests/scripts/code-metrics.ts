/**
 * House-keeping figures for the contributor guide and issue notes:
 * the longest functions in apps/api and packages/domain, and the places that take "today"
 * as a UTC calendar date instead of the department's local date.
 *
 *   node --import tsx tests/scripts/code-metrics.ts [--top 10]
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const root = path.resolve(import.meta.dirname, '../..');
const top = Number(process.argv[process.argv.indexOf('--top') + 1]) || 10;

function walk(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name === 'dist' || entry.name === 'migrations') continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else if (/\.(ts|vue)$/.test(entry.name) && !/\.d\.ts$/.test(entry.name)) out.push(full);
  }
  return out;
}

interface Fn {
  file: string;
  name: string;
  line: number;
  lines: number;
}

function functionsOf(file: string): Fn[] {
  const text = fs.readFileSync(file, 'utf8');
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
  const found: Fn[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isFunctionLike(node) && 'body' in node && node.body) {
      const start = source.getLineAndCharacterOfPosition(node.getStart(source)).line;
      const end = source.getLineAndCharacterOfPosition(node.getEnd()).line;
      let name = '(anonymous)';
      if ('name' in node && node.name && ts.isIdentifier(node.name as ts.Node)) name = (node.name as ts.Identifier).text;
      else if (ts.isVariableDeclaration(node.parent) && ts.isIdentifier(node.parent.name)) name = node.parent.name.text;
      found.push({ file: path.relative(root, file), name, line: start + 1, lines: end - start + 1 });
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

const serverFiles = [...walk(path.join(root, 'apps/api/src')), ...walk(path.join(root, 'packages/domain/src'))].filter(
  (f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && !f.includes('/seed/'),
);
const fns = serverFiles.flatMap(functionsOf).sort((a, b) => b.lines - a.lines);
console.log(`Longest functions in apps/api and packages/domain (seed excluded):`);
for (const f of fns.slice(0, top)) console.log(`  ${String(f.lines).padStart(4)} lines  ${f.file}:${f.line} ${f.name}`);

const utcToday = /new Date\(\)\.toISOString\(\)\.(slice\(0, ?10\)|split\('T'\))/;
const allFiles = [...walk(path.join(root, 'apps')), ...walk(path.join(root, 'packages'))].filter((f) => !f.endsWith('.test.ts'));
const hits: string[] = [];
for (const file of allFiles) {
  fs.readFileSync(file, 'utf8')
    .split('\n')
    .forEach((line, i) => {
      if (utcToday.test(line)) hits.push(`${path.relative(root, file)}:${i + 1}`);
    });
}
console.log(`\n"Today" taken as a UTC date: ${hits.length}`);
for (const h of hits) console.log(`  ${h}`);
