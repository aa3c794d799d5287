/**
 * Hostile input on every JSON write route: fast-check bodies of the wrong types, huge strings,
 * deep nesting, SQL and HTML fragments, odd unicode, negative / non-finite / out-of-range
 * numbers and impossible dates. Every answer is below 500, every refusal says why, and a
 * refused body leaves the database as it was (row counts and a checksum of every table).
 * Seeded (FUZZ_SEED, printed) so a failure replays.
 */
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import type http from 'node:http';
import type supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_COSTS } from '@swardwise/domain';
import { fieldRequests } from '../../apps/api/src/db/schema/index.ts';
import { withoutNegligible } from '../../apps/api/src/http/validate.ts';
import { ROUTES } from '../../apps/api/src/openapi/routes.ts';
import { useTestApi } from '../support/app.ts';
import { linePlanBody, newFieldBody } from '../support/bodies.ts';
import { giveWork } from '../support/fixture.ts';
import { CHECK, MATRIX } from '../support/route-matrix.ts';

const api = useTestApi();
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);
/**
 * Bodies per route; with the routes below about 10,000 a run (plus 6 raw ones per route).
 * Measured: about 100 ms a body on a machine loaded far past its cores, so the test's time
 * limit is generous; FUZZ_PER_ROUTE=20 for a quick local run.
 */
const PER_ROUTE = Number(process.env.FUZZ_PER_ROUTE ?? 200);

interface Ids {
  district: number;
  site: number;
  field: number;
  crew: number;
  workOrder: number;
  request: number;
  user: number;
  station: number;
  event: number;
  equipment: number;
}

interface FuzzRow {
  route: string;
  url(ids: Ids): string;
  /** A body the route takes, which the generators spoil. */
  base(ids: Ids): Record<string, unknown>;
  /** DELETE routes read `?version=` instead of a body. */
  query?: boolean;
}

const V = 1;
const FUZZ: FuzzRow[] = [
  { route: 'POST /api/auth/sign-in', url: () => '/api/auth/sign-in', base: () => ({ email: 'nobody@test.example', password: 'wrong-password' }) },
  { route: 'POST /api/auth/accept-invite', url: () => '/api/auth/accept-invite', base: () => ({ token: 'x'.repeat(40), password: 'a-long-enough-secret-42' }) },
  { route: 'POST /api/auth/forgot-password', url: () => '/api/auth/forgot-password', base: () => ({ email: 'nobody@test.example' }) },
  { route: 'POST /api/auth/reset-password', url: () => '/api/auth/reset-password', base: () => ({ token: 'x'.repeat(40), password: 'a-long-enough-secret-42' }) },
  { route: 'PATCH /api/auth/me', url: () => '/api/auth/me', base: () => ({ version: V, units: 'metric', name: 'Test admin' }) },
  { route: 'POST /api/users', url: () => '/api/users', base: (i) => ({ email: 'fuzz@test.example', name: 'Fuzz Person', role: 'foreman', districtId: i.district }) },
  { route: 'PATCH /api/users/:id', url: (i) => `/api/users/${i.user}`, base: () => ({ version: V, name: 'Renamed', active: true }) },
  { route: 'POST /api/weather/stations/:id/pull', url: (i) => `/api/weather/stations/${i.station}/pull`, base: () => ({ from: '2026-05-01', to: '2026-05-02' }) },
  { route: 'POST /api/work-orders', url: () => '/api/work-orders', base: (i) => ({ fieldId: i.field, task: 'mow', plannedDate: '2030-01-08', plannedHours: 1, crewId: i.crew }) },
  { route: 'PATCH /api/work-orders/:id', url: (i) => `/api/work-orders/${i.workOrder}`, base: (i) => ({ version: V, plannedHours: 2, plannedDate: '2030-01-09', crewId: i.crew, pinned: true }) },
  { route: 'DELETE /api/work-orders/:id', url: (i) => `/api/work-orders/${i.workOrder}`, base: () => ({ version: V }), query: true },
  { route: 'POST /api/work-orders/:id/reports', url: (i) => `/api/work-orders/${i.workOrder}/reports`, base: () => ({ status: 'started', note: 'ok', clientRef: 'abcdefgh12' }) },
  { route: 'POST /api/work-orders/:id/field-check', url: (i) => `/api/work-orders/${i.workOrder}/field-check`, base: () => ({ ...CHECK }) },
  { route: 'POST /api/work-orders/:id/reopen', url: (i) => `/api/work-orders/${i.workOrder}/reopen`, base: () => ({ reason: 'again' }) },
  { route: 'POST /api/week-plans/generate', url: () => '/api/week-plans/generate', base: (i) => ({ districtId: i.district, weekStart: '2030-01-07', dryRun: true }) },
  { route: 'POST /api/week-plans/confirm', url: () => '/api/week-plans/confirm', base: (i) => ({ districtId: i.district, weekStart: '2030-01-07' }) },
  { route: 'POST /api/week-plans/rain-out', url: () => '/api/week-plans/rain-out', base: (i) => ({ districtId: i.district, date: '2030-01-09', reason: 'thunderstorms', crewId: i.crew }) },
  {
    route: 'POST /api/sites',
    url: () => '/api/sites',
    base: (i) => ({ districtId: i.district, name: 'Fuzz Park', kind: 'park', owner: 'city', address: '1 Elm', lat: 37.6, lng: -66.5, notes: '' }),
  },
  { route: 'PATCH /api/sites/:id', url: (i) => `/api/sites/${i.site}`, base: () => ({ version: V, notes: 'x', name: 'Test Park North', lat: 37.6 }) },
  {
    route: 'POST /api/fields',
    url: () => '/api/fields',
    base: (i) => newFieldBody(i.site, 'Fuzz field'),
  },
  { route: 'PATCH /api/fields/:id', url: (i) => `/api/fields/${i.field}`, base: () => ({ version: V, notes: 'x', maintenanceLevel: 2, hocOverrideMm: 40 }) },
  { route: 'DELETE /api/fields/:id', url: (i) => `/api/fields/${i.field}`, base: () => ({ version: V }), query: true },
  { route: 'POST /api/fields/:id/checks', url: (i) => `/api/fields/${i.field}/checks`, base: () => ({ ...CHECK, hardnessReadingsG: [80, 90], hardnessDevice: 'clegg_2_25kg' }) },
  {
    route: 'POST /api/fields/:id/closures',
    url: (i) => `/api/fields/${i.field}/closures`,
    base: () => ({ version: V, status: 'closed', reason: 'wet', note: '', expectedReopenOn: '2030-01-10' }),
  },
  { route: 'POST /api/fields/:id/reopen', url: (i) => `/api/fields/${i.field}/reopen`, base: () => ({ version: V, note: '' }) },
  { route: 'PATCH /api/fields/:id/stripes', url: (i) => `/api/fields/${i.field}/stripes`, base: () => ({ pattern: 'lengthwise', version: V, mowerId: null }) },
  {
    route: 'POST /api/field-events',
    url: () => '/api/field-events',
    base: (i) => ({ fieldId: i.field, kind: 'practice', title: 'Fuzz practice', startsOn: '2030-02-01', startTime: '18:00' }),
  },
  { route: 'PATCH /api/field-events/:id', url: (i) => `/api/field-events/${i.event}`, base: () => ({ version: V, notes: 'x', startsOn: '2030-02-02' }) },
  { route: 'DELETE /api/field-events/:id', url: (i) => `/api/field-events/${i.event}`, base: () => ({ version: V }), query: true },
  { route: 'POST /api/requests', url: () => '/api/requests', base: (i) => ({ fieldId: i.field, kind: 'game_lines', gameOn: '2030-02-01', layout: 'soccer', description: 'Lines please' }) },
  { route: 'PATCH /api/requests/:id', url: (i) => `/api/requests/${i.request}`, base: () => ({ version: V, description: 'Changed words' }) },
  { route: 'POST /api/requests/:id/messages', url: (i) => `/api/requests/${i.request}/messages`, base: () => ({ body: 'A word' }) },
  {
    route: 'POST /api/requests/:id/schedule',
    url: (i) => `/api/requests/${i.request}/schedule`,
    base: (i) => ({ version: V, note: '', work: { task: 'mow', plannedDate: '2030-01-08', plannedHours: 1, crewId: i.crew } }),
  },
  { route: 'POST /api/requests/:id/decline', url: (i) => `/api/requests/${i.request}/decline`, base: () => ({ version: V, reason: 'Not this week' }) },
  { route: 'POST /api/requests/:id/close', url: (i) => `/api/requests/${i.request}/close`, base: () => ({ version: V, note: '' }) },
  { route: 'PATCH /api/standards/:level', url: () => '/api/standards/3', base: () => ({ version: V, targetScore: 70, minMowingsPerWeek: 2, hocMm: { soccer: { cool: 40 } } }) },
  { route: 'PATCH /api/settings', url: () => '/api/settings', base: () => ({ version: V, timeZone: 'America/Chicago' }) },
  { route: 'POST /api/crews', url: () => '/api/crews', base: (i) => ({ districtId: i.district, name: 'Fuzz Crew', hoursPerDay: 8, members: ['A. B.'], workDays: ['mon'] }) },
  { route: 'PATCH /api/crews/:id', url: (i) => `/api/crews/${i.crew}`, base: () => ({ version: V, hoursPerDay: 7, members: ['C. D.'] }) },
  { route: 'DELETE /api/crews/:id', url: (i) => `/api/crews/${i.crew}`, base: () => ({ version: V }), query: true },
  {
    route: 'POST /api/equipment',
    url: () => '/api/equipment',
    base: (i) => ({ districtId: i.district, kind: 'rotary_mower', name: 'Fuzz mower', cuttingWidthM: 1.5, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 20, hocMaxMm: 90 }),
  },
  { route: 'PATCH /api/equipment/:id', url: (i) => `/api/equipment/${i.equipment}`, base: () => ({ version: V, notes: 'x', hourMeterH: 12 }) },
  { route: 'DELETE /api/equipment/:id', url: (i) => `/api/equipment/${i.equipment}`, base: () => ({ version: V }), query: true },
  { route: 'POST /api/calendar-feeds', url: () => '/api/calendar-feeds', base: (i) => ({ crewId: i.crew }) },
  { route: 'PATCH /api/costs', url: () => '/api/costs', base: (i) => ({ ...DEFAULT_COSTS, crewRates: [{ crewId: i.crew, ratePerHour: 40 }], version: V }) },
  { route: 'PATCH /api/budget/line', url: () => '/api/budget/line', base: (i) => ({ season: 2026, districtId: i.district, line: 'fuel', amount: 1200, version: V }) },
  { route: 'POST /api/what-if/scenarios', url: () => '/api/what-if/scenarios', base: (i) => ({ name: 'Fuzzed', change: { season: 2026, districtId: i.district, moves: [{ fieldId: i.field, level: 3 }], standards: { '2': { lineRepaintDays: 10 } } } }) },
  { route: 'POST /api/what-if', url: () => '/api/what-if', base: (i) => ({ season: 2026, districtId: i.district, moves: [{ fieldId: i.field, level: 2 }], standards: { '3': { minMowingsPerWeek: 2 } } }) },
  {
    route: 'POST /api/work-orders/:id/application',
    url: (i) => `/api/work-orders/${i.workOrder}/application`,
    base: () => ({ product: 'Broadleaf herbicide', rate: 1.1, rateUnit: 'fl oz/1000 ft²', areaM2: 600, appliedOn: '2026-05-26', applicator: 'A. Tester', licenceNumber: 'QA-1234' }),
  },
  {
    route: 'PATCH /api/fields/:id/lines',
    url: (i) => `/api/fields/${i.field}/lines`,
    base: () => linePlanBody({ layouts: [{ layout: 'soccer_full', lengthM: 100, widthM: 64, colour: '#ffffff', alongM: 0, acrossM: 0, rotationDeg: 0 }] }),
  },
  { route: 'PATCH /api/fields/:id/logos/:logoId', url: (i) => `/api/fields/${i.field}/logos/1`, base: () => ({ version: V, centerXM: 50, centerYM: 30, widthM: 8, rotationDeg: 30, gridSpacingM: 1 }) },
  { route: 'DELETE /api/fields/:id/logos/:logoId', url: (i) => `/api/fields/${i.field}/logos/1`, base: () => ({ version: V }), query: true },
  { route: 'POST /api/game-days/events/:eventId', url: (i) => `/api/game-days/events/${i.event}`, base: () => ({ steps: ['mow', 'paint_lines', 'field_check'] }) },
];

/** Write routes that take no JSON body worth spoiling, or only files (the upload tests take those). */
const NOT_FUZZED = new Map<string, string>([
  ['POST /api/auth/sign-out', 'no body; it ends the session the fuzzing runs on'],
  ['POST /api/imports/:id/commit', 'no body'],
  ['POST /api/imports/:id/undo', 'no body'],
  ['DELETE /api/dev/mail', 'no body; developer sink'],
  ['DELETE /api/calendar-feeds/:id', 'no body'],
  ['POST /api/mail-outbox/:id/retry', 'no body'],
  ['DELETE /api/what-if/scenarios/:id', 'no body'],
  ['POST /api/weather/stations/:id/csv', 'a file (uploads)'],
  ['POST /api/imports', 'a file (uploads)'],
  ['POST /api/work-orders/:id/photos', 'a file (uploads)'],
  ['POST /api/fields/:id/checks/:checkId/photos', 'a file (uploads)'],
  ['POST /api/requests/:id/photos', 'a file (uploads)'],
  ['POST /api/fields/:id/logos', 'a file (tests/api/logos.test.ts sends hostile SVGs and pictures)'],
]);

// ---- generators ---------------------------------------------------------------------------

const SQL = ["' OR '1'='1", "'; DROP TABLE users; --", '1; SELECT pg_sleep(5)', "' UNION SELECT password_hash FROM users --", '$1', '\\x00', "1' AND 1=CAST((SELECT version()) AS int)--"];
const HTML = ['<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '"><svg onload=alert(1)>', 'javascript:alert(1)', '{{constructor.constructor("alert(1)")()}}', '<!--', ']]>'];
const UNICODE = ['\u0000', '\u202Eevil', 'Z\u0351\u0368\u0352', '\uD800', '\uFEFF', '𝕳𝖊𝖑𝖑𝖔', '🏟️'.repeat(50), '\u2028\u2029', 'İstanbul'.toLowerCase(), 'ﬁeld'];
const DATES = ['2026-02-30', '2026-13-01', '0000-01-01', '9999-12-31', '+275760-09-13', '2026-1-1', '2026-06-01T25:00:00Z', '1899-12-31', '2201-01-01', 'yesterday', ''];
const NUMBERS = [-1, 0, -0, 1e308, -1e308, 2 ** 31, 2 ** 53 + 2, -(2 ** 31) - 1, 0.1 + 0.2, 1e-320, 123456789012, 3.5];

const hostileString = fc.oneof(
  fc.constantFrom(...SQL, ...HTML, ...UNICODE, ...DATES),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 30 }),
  fc.integer({ min: 2_000, max: 100_000 }).map((n) => 'A'.repeat(n)),
  fc.tuple(fc.constantFrom(...SQL, ...HTML), fc.string({ maxLength: 10 })).map(([a, b]) => a + b),
);
/** JSON cannot carry NaN or Infinity: JSON.stringify writes null for them, as a client would. */
const hostileNumber = fc.oneof(fc.constantFrom(...NUMBERS, NaN, Infinity, -Infinity), fc.double(), fc.integer({ min: -(2 ** 40), max: 2 ** 40 }));
const deep = fc.integer({ min: 30, max: 400 }).chain((depth) =>
  fc.constantFrom('array', 'object').map((kind) => {
    let v: unknown = 1;
    for (let i = 0; i < depth; i++) v = kind === 'array' ? [v] : { a: v };
    return v;
  }),
);
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileString },
  { weight: 3, arbitrary: hostileNumber },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [null], { $gt: '' }, { __proto__: { admin: true } }, ['admin']) },
  { weight: 1, arbitrary: deep },
  { weight: 1, arbitrary: fc.array(hostileString, { maxLength: 200 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
);
const ownKeys = ['__proto__', 'constructor', 'prototype', 'role', 'districtId', 'id', 'createdBy', 'passwordHash', 'version', '$where'];

/** A hostile body built from the route's own: fields spoiled, dropped or added, or no object at all. */
function bodies(base: Record<string, unknown>): fc.Arbitrary<unknown> {
  const keys = Object.keys(base);
  const spoiled = fc
    .tuple(fc.subarray(keys, { minLength: 1 }), fc.array(hostileValue, { minLength: keys.length, maxLength: keys.length }))
    .map(([chosen, values]) => {
      const body: Record<string, unknown> = { ...base };
      chosen.forEach((k, i) => (body[k] = values[i]));
      return body;
    });
  const dropped = fc.subarray(keys, { minLength: 1 }).map((gone) => Object.fromEntries(Object.entries(base).filter(([k]) => !gone.includes(k))));
  const extra = fc.tuple(fc.constantFrom(...ownKeys), hostileValue, fc.subarray(keys, { minLength: 1, maxLength: 1 }), hostileValue).map(([k, v, [s], sv]) => {
    const body: Record<string, unknown> = JSON.parse(`{"${k}": ${JSON.stringify(v) ?? 'null'}}`);
    return { ...base, ...body, [s!]: sv };
  });
  return fc.oneof({ weight: 6, arbitrary: spoiled }, { weight: 1, arbitrary: dropped }, { weight: 2, arbitrary: extra }, { weight: 1, arbitrary: hostileValue });
}

const rawJson = fc.constantFrom('{', '{"a":', '[1,2', '{"version": 1,}', "{'a': 1}", 'null', '"string"', '1e999999', '{"a": NaN}', '\u0000', '{"__proto__": {"x": 1}}');

// ---- the database before and after ------------------------------------------------------------

/**
 * Tables whose rows change on every request of a signed-in session, whatever the body, and
 * the attempt counters of the sign-in and reset routes, which count each attempt before its
 * body is read.
 */
const VOLATILE = new Set(['sessions', '__drizzle_migrations', 'rate_limits']);
/**
 * Tables whose rows change after they are written, by background work: the outbox's sender
 * marks mail queued by an accepted body as tried or sent while later bodies are refused. Only
 * which rows exist is compared there, so a refused body that queued a mail is still caught.
 */
const ROWS_ONLY = new Set(['mail_outbox']);

async function snapshot(): Promise<string> {
  const query = async <T,>(text: string) => (await api.database.db.execute(sql.raw(text))).rows as T[];
  const tables = await query<{ name: string }>("select tablename as name from pg_tables where schemaname = 'public' order by tablename");
  const parts = tables.filter((t) => !VOLATILE.has(t.name)).map((t) => `select '${t.name}' as t, count(*)::text as n, coalesce(md5(string_agg(x::text, '|' order by x::text)), '') as h from ${ROWS_ONLY.has(t.name) ? `(select id from "${t.name}") x` : `"${t.name}" x`}`);
  const rows = await query<{ t: string; n: string; h: string }>(parts.join(' union all '));
  return rows.map((r) => `${r.t}:${r.n}:${r.h}`).join('\n');
}

const changedTables = (a: string, b: string) => {
  const was = new Set(a.split('\n'));
  return b
    .split('\n')
    .filter((line) => !was.has(line))
    .map((line) => line.split(':')[0]!);
};
const changed = (a: string, b: string) => `the tables ${changedTables(a, b).join(', ')}`;

/** Refusals that rightly leave a trace: a failed sign-in counts against the account and the address. */
const MAY_RECORD = new Map<string, string[]>([['POST /api/auth/sign-in', ['audit_log']]]);

let server: http.Server;
let ids: Ids;
let admin: ReturnType<typeof supertest.agent>;

beforeAll(async () => {
  const f = api.fixture;
  // One listening server for all bodies (supertest would otherwise start one per request).
  server = api.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  admin = await api.signIn('admin', server as never);
  const [request] = await api.database.db
    .insert(fieldRequests)
    .values({ fieldId: f.fields.northSoccer, siteId: f.sites.northPark, districtId: f.districts.north, kind: 'wet_area', description: 'Puddles', createdBy: f.users.admin.id })
    .returning({ id: fieldRequests.id });
  const event = await admin.post('/api/field-events').send({ fieldId: f.fields.northSoccer, kind: 'game', title: 'Fuzz game', startsOn: '2030-03-01' });
  const kit = await admin.post('/api/equipment').send({ districtId: f.districts.north, kind: 'spreader', name: 'Fuzz spreader' });
  ids = {
    district: f.districts.north,
    site: f.sites.northPark,
    field: f.fields.northSoccer,
    crew: f.crews.north,
    workOrder: await giveWork(api.database.db, f.fields.northSoccer, f.crews.north, 1),
    request: request!.id,
    user: f.users.crew.id,
    station: f.weather.stationId,
    event: event.body.event.id,
    equipment: kit.body.equipment?.id ?? kit.body.id,
  };
}, 60_000);
afterAll(() => new Promise((r) => server.close(r)));

describe('hostile bodies on every write route', () => {
  test('should fuzz every JSON write route the matrix lists (or say why not)', () => {
    const writes = MATRIX.map((r) => r.route).filter((r) => /^(POST|PATCH|PUT|DELETE) /.test(r));
    const missing = writes.filter((r) => !NOT_FUZZED.has(r) && !FUZZ.some((f) => f.route === r));
    expect(missing, `add a FUZZ row (or a NOT_FUZZED reason) in tests/api/hostile-input.test.ts for:\n${missing.join('\n')}`).toEqual([]);
  });

  test('should answer each with 2xx or a 4xx that says why, never 5xx, and change nothing when refused', async () => {
    const failures: string[] = [];
    let sent = 0;
    let accepted = 0;
    let snapshots = 0;
    let before = await snapshot();
    /**
     * Bodies the route's schema refuses, sent since the last snapshot: none of them may have
     * written. One snapshot per route's run of them (its row counts and checksums are what
     * costs), so a failure names the run and its first and last body; replay it with FUZZ_SEED.
     */
    let window: string[] = [];
    const settle = async (route: string) => {
      if (window.length === 0) return;
      const after = await snapshot();
      snapshots++;
      if (after !== before) failures.push(`${route}: one of ${window.length} refused bodies changed ${changed(before, after)} (first ${window[0]}, last ${window.at(-1)})`);
      before = after;
      window = [];
    };
    const send = async (route: string, request: () => PromiseLike<supertest.Response>, shown: string, valid: boolean) => {
      // A body the schema takes may be written: it is checked on its own, between two snapshots.
      if (valid) await settle(route);
      const res = await request();
      sent++;
      // An error answer shows no hash, secret or stack of the server.
      if (/\$argon2|test-secret|node_modules|\.ts:\d+:\d+/.test(res.text ?? '')) failures.push(`${route} showed server internals to ${shown}: ${res.text.slice(0, 200)}`);
      if (res.status >= 500) failures.push(`${route} answered ${res.status} to ${shown}: ${JSON.stringify(res.body).slice(0, 300)}`);
      else if (res.status >= 300) {
        const message = (res.body as { error?: { message?: unknown } })?.error?.message;
        // 431: Node's HTTP parser refuses headers (here the URL) over 16 KB before the app sees them.
        if (res.status !== 431 && (typeof message !== 'string' || message.length < 5)) failures.push(`${route} answered ${res.status} without a message to ${shown}`);
      } else accepted++;
      if (!valid && res.status < 300) failures.push(`${route} took ${shown}, which its schema refuses`);
      if (valid) {
        // What an accepted body starts after its answer (mail to the foreman or partner) lands
        // before the snapshot, not among the refused bodies that follow.
        await api.background.idle();
        const after = await snapshot();
        snapshots++;
        if (res.status >= 300 && after !== before && !MAY_RECORD.get(route)?.some((t) => changedTables(before, after).every((c) => c === t)))
          failures.push(`${route} refused ${shown} with ${res.status} but changed ${changed(before, after)}`);
        before = after;
      } else window.push(shown);
    };
    for (const [index, row] of FUZZ.entries()) {
      const method = row.route.split(' ')[0]!;
      const doc = ROUTES.find((r) => `${r.method.toUpperCase()} ${r.path}` === row.route);
      const schema = row.query ? doc?.query : doc?.body;
      if (!schema) throw new Error(`${row.route}: no ${row.query ? 'query' : 'body'} schema in apps/api/src/openapi/routes.ts`);
      // The API reads negligible numbers as zero before its schema (http/validate.ts); so does this check.
      const takes = (input: unknown) => schema.safeParse(withoutNegligible(input)).success;
      const url = row.url(ids);
      const call = (target: string) => admin[method.toLowerCase() as 'post'](target);
      const samples = fc.sample(bodies(row.base(ids)), { seed: SEED + index, numRuns: PER_ROUTE });
      for (const body of samples) {
        const text = JSON.stringify(body) ?? 'null';
        const shown = text.length > 160 ? `${text.slice(0, 160)}… (${text.length} chars)` : text;
        if (row.query) {
          const value = typeof body === 'object' && body && 'version' in body ? (body as { version: unknown }).version : body;
          // A lone surrogate cannot go in a URL: as UTF-8 it becomes U+FFFD, as a browser would send it.
          const version = Buffer.from(typeof value === 'string' ? value : (JSON.stringify(value) ?? '')).toString();
          await send(row.route, () => call(`${url}?version=${encodeURIComponent(version)}`), `?version=${version.slice(0, 160)}`, takes({ version }));
        } else {
          // As JSON text, so top-level strings, numbers and booleans go as a client would send them.
          await send(row.route, () => call(url).set('Content-Type', 'application/json').send(text), shown, takes(JSON.parse(text)));
        }
        if (failures.length > 20) break;
      }
      for (const raw of fc.sample(rawJson, { seed: SEED + index, numRuns: 6 })) {
        await send(row.route, () => call(url).set('Content-Type', 'application/json').send(raw), `raw ${raw}`, false);
      }
      await settle(row.route);
    }
    console.log(`hostile input: ${sent} bodies on ${FUZZ.length} routes, seed ${SEED}; ${accepted} taken, ${sent - accepted} refused; ${snapshots} database snapshots`);
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(FUZZ.length * PER_ROUTE);
    // The generators are hostile: a body taken as valid is the exception.
    expect(accepted).toBeLessThan(sent / 20);
  }, 900_000);
});
