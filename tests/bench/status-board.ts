/**
 * Public status board benchmark: the demo city plus 5,000 invented fields, a fifth of them
 * closed or restricted with a closure on record and a history row each, in an in-memory
 * PGlite; `GET /api/public/status` (no sign-in) timed over loopback: the first answer after a
 * change (the one query and the JSON), the cached answers, and 304s to If-None-Match; then the
 * board page in chromium on a 390 × 844 phone from navigation start to the fields drawn.
 * All data is invented. Needs a built portal (`npm run build`) for the browser part.
 * Run: node --import tsx tests/bench/status-board.ts
 */
import { performance } from 'node:perf_hooks';
import { eq, sql } from 'drizzle-orm';
import { CLOSURE_REASONS } from '@swardwise/domain';
import { fieldClosures, fields } from '../../apps/api/src/db/schema/index.ts';
import { launchBrowser, PHONE } from '../e2e/browser.ts';
import { demoCityWithFields, fmt, listenSignedIn } from './support.ts';

const EXTRA_FIELDS = 5000;
const RUNS = 40;
const CHANGES = 10;

const { rand, pick, database, db, inserted } = await demoCityWithFields(20261202, EXTRA_FIELDS, ({ pick }) => ({
  status: pick(['open', 'open', 'open', 'open', 'restricted', 'closed'] as const),
}));
const t0 = Date.parse('2026-11-01T12:00:00Z');
const closures = inserted
  .filter((f) => f.status !== 'open')
  .flatMap((f) => {
    const from = new Date(t0 + rand() * 20 * 86_400_000);
    const earlier = new Date(from.getTime() - 3 * 86_400_000);
    return [
      { fieldId: f.id, status: 'closed' as const, reason: pick(CLOSURE_REASONS), note: 'Invented earlier closure', fromAt: earlier, toAt: from },
      { fieldId: f.id, status: f.status as 'closed' | 'restricted', reason: pick(CLOSURE_REASONS), note: 'Invented bench closure', fromAt: from, expectedReopenOn: rand() < 0.5 ? '2026-12-10' : null },
    ];
  });
for (let i = 0; i < closures.length; i += 500) await db.insert(fieldClosures).values(closures.slice(i, i + 500));
const [{ n: total } = { n: 0 }] = await db.select({ n: sql<number>`count(*)::int` }).from(fields);

const { server, base } = await listenSignedIn(db, 'head');
const url = `${base}/api/public/status`;

async function timeGet(headers: Record<string, string> = {}) {
  const start = performance.now();
  const res = await fetch(url, { headers });
  const text = await res.text();
  return { ms: performance.now() - start, status: res.status, bytes: Buffer.byteLength(text), etag: res.headers.get('etag') ?? '' };
}

const first = await timeGet();
console.log(`fields: ${total} (${closures.length / 2} closed or restricted); answer ${(first.bytes / 1024).toFixed(0)} kB`);
console.log(`GET /api/public/status first (uncached): ${first.ms.toFixed(1)} ms`);
const cached: number[] = [];
for (let i = 0; i < RUNS; i++) cached.push((await timeGet()).ms);
console.log(`cached, ${RUNS} sequential: ${fmt(cached)}`);
const notModified: number[] = [];
for (let i = 0; i < RUNS; i++) {
  const r = await timeGet({ 'If-None-Match': first.etag });
  if (r.status !== 304) throw new Error(`expected 304, got ${r.status}`);
  notModified.push(r.ms);
}
console.log(`304 to If-None-Match, ${RUNS} sequential: ${fmt(notModified)}`);
const afterChange: number[] = [];
for (let i = 0; i < CHANGES; i++) {
  // A field changes (as a closure bumps its version): the next answer runs the query again.
  await db.update(fields).set({ version: sql`${fields.version} + 1`, updatedAt: new Date() }).where(eq(fields.id, inserted[i]!.id));
  afterChange.push((await timeGet()).ms);
}
console.log(`first answer after a change, ${CHANGES} changes: ${fmt(afterChange)}`);

const browser = await launchBrowser().catch(() => null);
if (browser) {
  try {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const loads: number[] = [];
    for (let i = 0; i < 3; i++) {
      const start = performance.now();
      await page.goto(`${base}/status`);
      const ok = await page
        .locator('[data-test="status-field"]')
        .first()
        .waitFor({ timeout: 30_000 })
        .then(() => true)
        .catch(() => false);
      if (!ok) {
        console.log('browser part skipped: the portal is not built (npm run build)');
        break;
      }
      loads.push(performance.now() - start);
    }
    if (loads.length) console.log(`board page on a phone, navigation → first field drawn (${await page.locator('[data-test="status-field"]').count()} drawn), ${loads.length} loads: ${fmt(loads)}`);
  } finally {
    await browser.close();
  }
}
server.close();
await database.close();
