/**
 * The authorization matrix: one row per API route, saying which roles may call it on rows of
 * their own district / site / crew ("own") and on another's ("other"), and how to call it
 * with real ids of either scope. `tests/api/authz-matrix.test.ts` runs every row as every
 * role and signed out; `tests/api/hostile-input.test.ts` reuses the write rows' calls.
 *
 * A new route: add one row here (the matrix test fails and prints the rows it misses).
 */
import crypto from 'node:crypto';
import type { Db } from '../../apps/api/src/db/client.ts';
import { calendarFeeds, mailOutbox, whatIfScenarios } from '../../apps/api/src/db/schema/index.ts';
import type supertest from 'supertest';
import { DEFAULT_COSTS, type Role } from '@swardwise/domain';
import { newFieldBody } from './bodies.ts';

export type Agent = ReturnType<typeof supertest.agent>;
/** A request on its way (supertest's Test) or the answer of one awaited first. */
export type Pending = PromiseLike<supertest.Response>;

/** The ids of one scope as seen from the north district's foreman, crew lead and partner. */
export interface ScopeIds {
  district: number;
  /** A site of the district; the partner's linked site on the own side. */
  site: number;
  /** A field of that site; the crew lead has work on the own one. */
  field: number;
  crew: number;
  workOrder: number;
  equipment: number;
  /** A booking: made by the partner on the own side, by the department on the other. */
  event: number;
  /** A field request: filed by the partner on the own side, by an administrator on the other. */
  request: number;
  check: number;
  importId: number;
  /** A user of the district who is not the caller (the crew lead; the other foreman). */
  user: number;
  station: number;
  /** A token of a calendar feed (the partner's own; a crew feed of the other district). */
  feedToken: string;
  /** Whose calendar feed a new feed of this scope is: the partner's own; a crew's of the other district. */
  feedOwner: { kind: 'partner' | 'crew'; userId?: number; crewId?: number; districtId?: number };
}

export interface Call {
  agent: Agent;
  ids: ScopeIds;
  db: Db;
  /** A unique suffix, for names that must not repeat. */
  n: number;
  /** A fresh signed-in agent of the same caller (for sign-out, which ends the session it is sent on). */
  fresh(): Promise<Agent>;
}

/**
 * Who may: `public` (anyone, signed in or not), `everyone` (any signed-in role), or a list of
 * roles, each alone (on rows of any scope) or with `:own` (only on rows of their own scope).
 * A role not listed is refused: 403, or 404 where the route does not tell a row out of the
 * caller's scope from one that does not exist.
 */
export interface MatrixRow {
  route: string;
  allow: string;
  /**
   * What an allowed caller gets: 'ok' is any answer past the check of who is asking (2xx, or a
   * 400/409/422 about the body or the row's state); 404 where the call names a row that does
   * not exist behind the checked one (a photo id; the answer's code names the photo).
   */
  allowed?: 'ok' | 404 | 503;
  /**
   * Why the route is narrower than its ability (the cross-check with the abilities skips the
   * row): e.g. only the uploader commits an import.
   */
  narrower?: string;
  /** false: the route names no scoped row, so it is called once, not once per scope. */
  scoped?: boolean;
  call(c: Call): Pending;
}

/** A version no row has reached: an allowed caller gets 409 and nothing is written. */
const STALE = 999_999;
const MONDAY = '2030-01-07';
const PNG_1PX = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
export const CHECK = { turfCoverPct: 90, weedsPct: 2, bareWornPct: 3, evenness: 4, divots: 4, heightMm: 40 };
const CSV = Buffer.from('date,tmax_c,tmin_c\n2026-05-01,20,10\n');

export const MATRIX: MatrixRow[] = [
  // Open to all
  { route: 'GET /api/health', allow: 'public', scoped: false, call: (c) => c.agent.get('/api/health') },
  { route: 'GET /api/config', allow: 'public', scoped: false, call: (c) => c.agent.get('/api/config') },
  { route: 'GET /api/openapi.json', allow: 'public', scoped: false, call: (c) => c.agent.get('/api/openapi.json') },
  { route: 'GET /api/public/status', allow: 'public', scoped: false, call: (c) => c.agent.get('/api/public/status') },
  { route: 'POST /api/auth/sign-in', allow: 'public', scoped: false, call: (c) => c.agent.post('/api/auth/sign-in').send({ email: 'nobody@test.example' }) },
  { route: 'POST /api/auth/sign-out', allow: 'public', scoped: false, call: async (c) => (await c.fresh()).post('/api/auth/sign-out') },
  {
    route: 'POST /api/auth/accept-invite',
    allow: 'public',
    scoped: false,
    call: (c) => c.agent.post('/api/auth/accept-invite').send({ token: 'x'.repeat(40), password: 'a-long-enough-secret-42' }),
  },
  { route: 'POST /api/auth/forgot-password', allow: 'public', scoped: false, call: (c) => c.agent.post('/api/auth/forgot-password').send({ email: 'nobody@test.example' }) },
  {
    route: 'POST /api/auth/reset-password',
    allow: 'public',
    scoped: false,
    call: (c) => c.agent.post('/api/auth/reset-password').send({ token: 'x'.repeat(40), password: 'a-long-enough-secret-42' }),
  },
  // The token is the credential: a feed of either scope answers anyone who has its address.
  { route: 'GET /api/calendar/:token.ics', allow: 'public', call: (c) => c.agent.get(`/api/calendar/${c.ids.feedToken}.ics`) },

  // Own account
  { route: 'GET /api/auth/me', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/auth/me') },
  { route: 'PATCH /api/auth/me', allow: 'everyone', scoped: false, call: (c) => c.agent.patch('/api/auth/me').send({ version: STALE, units: 'metric' }) },

  // Users
  { route: 'GET /api/users', allow: 'admin foreman', scoped: false, call: (c) => c.agent.get('/api/users') },
  { route: 'POST /api/users', allow: 'admin', scoped: false, call: (c) => c.agent.post('/api/users').send({ email: `new${c.n}@test.example`, name: 'New Person', role: 'head' }) },
  { route: 'PATCH /api/users/:id', allow: 'admin', call: (c) => c.agent.patch(`/api/users/${c.ids.user}`).send({ version: STALE, name: 'Renamed' }) },

  // Weather
  { route: 'GET /api/weather/stations', allow: 'admin head foreman crew', scoped: false, call: (c) => c.agent.get('/api/weather/stations') },
  {
    route: 'GET /api/weather/stations/:id/days',
    allow: 'admin head foreman crew',
    scoped: false,
    call: (c) => c.agent.get(`/api/weather/stations/${c.ids.station}/days?from=2026-05-04&to=2026-05-10`),
  },
  { route: 'POST /api/weather/stations/:id/csv', allow: 'admin foreman', scoped: false, call: (c) => c.agent.post(`/api/weather/stations/${c.ids.station}/csv`).attach('file', CSV, 'station.csv') },
  {
    route: 'POST /api/weather/stations/:id/pull',
    allow: 'admin foreman',
    scoped: false,
    // The test API has no weather service: an allowed caller is told so (503 weather/not_configured).
    allowed: 503,
    call: (c) => c.agent.post(`/api/weather/stations/${c.ids.station}/pull`).send({ from: '2026-05-01', to: '2026-05-02' }),
  },

  // Work orders
  { route: 'GET /api/work-orders', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/work-orders') },
  {
    route: 'POST /api/work-orders',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/work-orders').send({ fieldId: c.ids.field, task: 'mow', plannedDate: '2030-01-08', plannedHours: 1 }),
  },
  { route: 'GET /api/work-orders/:id', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/work-orders/${c.ids.workOrder}`) },
  {
    route: 'PATCH /api/work-orders/:id',
    allow: 'admin foreman:own',
    call: (c) => c.agent.patch(`/api/work-orders/${c.ids.workOrder}`).send({ version: STALE, plannedHours: 2 }),
  },
  { route: 'DELETE /api/work-orders/:id', allow: 'admin foreman:own', call: (c) => c.agent.delete(`/api/work-orders/${c.ids.workOrder}?version=${STALE}`) },
  {
    route: 'POST /api/work-orders/:id/reports',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/work-orders/${c.ids.workOrder}/reports`).send({ status: 'started' }),
  },
  {
    route: 'POST /api/work-orders/:id/field-check',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/work-orders/${c.ids.workOrder}/field-check`).send(CHECK),
  },
  { route: 'POST /api/work-orders/:id/reopen', allow: 'admin foreman:own crew:own', call: (c) => c.agent.post(`/api/work-orders/${c.ids.workOrder}/reopen`).send({ reason: 'again' }) },
  {
    route: 'POST /api/work-orders/:id/photos',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/work-orders/${c.ids.workOrder}/photos`).attach('photo', PNG_1PX, 'p.png'),
  },
  {
    route: 'GET /api/work-orders/:id/photos/:photoId',
    allow: 'admin head foreman:own crew:own partner:own',
    allowed: 404,
    call: (c) => c.agent.get(`/api/work-orders/${c.ids.workOrder}/photos/999999`),
  },

  // Week plans
  {
    route: 'GET /api/week-plans',
    allow: 'admin head foreman:own',
    call: (c) => c.agent.get(`/api/week-plans?districtId=${c.ids.district}&weekStart=${MONDAY}`),
  },
  {
    route: 'POST /api/week-plans/generate',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/week-plans/generate').send({ districtId: c.ids.district, weekStart: MONDAY, dryRun: true }),
  },
  {
    route: 'POST /api/week-plans/confirm',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/week-plans/confirm').send({ districtId: c.ids.district, weekStart: MONDAY }),
  },
  {
    route: 'POST /api/week-plans/rain-out',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/week-plans/rain-out').send({ districtId: c.ids.district, date: '2030-01-09', reason: 'thunderstorms' }),
  },
  { route: 'GET /api/overview', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/overview?districtId=${c.ids.district}`) },
  { route: 'GET /api/records', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/records') },

  // Sites and fields
  { route: 'GET /api/sites', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/sites') },
  {
    route: 'POST /api/sites',
    allow: 'admin head foreman:own',
    call: (c) => c.agent.post('/api/sites').send({ districtId: c.ids.district, name: `Matrix Park ${c.n}`, kind: 'park', owner: 'city', address: '', lat: 37.6, lng: -66.5 }),
  },
  { route: 'GET /api/sites/:id', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/sites/${c.ids.site}`) },
  { route: 'PATCH /api/sites/:id', allow: 'admin head foreman:own', call: (c) => c.agent.patch(`/api/sites/${c.ids.site}`).send({ version: STALE, notes: 'x' }) },
  { route: 'GET /api/fields', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/fields') },
  {
    route: 'POST /api/fields',
    allow: 'admin head foreman:own',
    call: (c) =>
      c.agent.post('/api/fields').send(newFieldBody(c.ids.site, `Matrix ${c.n}`)),
  },
  { route: 'GET /api/fields/:id', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}`) },
  { route: 'PATCH /api/fields/:id', allow: 'admin head foreman:own', call: (c) => c.agent.patch(`/api/fields/${c.ids.field}`).send({ version: STALE, notes: 'x' }) },
  { route: 'DELETE /api/fields/:id', allow: 'admin foreman:own', call: (c) => c.agent.delete(`/api/fields/${c.ids.field}?version=${STALE}`) },
  { route: 'GET /api/fields/:id/checks', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/checks`) },
  {
    route: 'POST /api/fields/:id/checks',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/fields/${c.ids.field}/checks`).send(CHECK),
  },
  {
    route: 'POST /api/fields/:id/checks/:checkId/photos',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/fields/${c.ids.field}/checks/${c.ids.check}/photos`).attach('photo', PNG_1PX, 'p.png'),
  },
  {
    route: 'GET /api/fields/:id/checks/:checkId/photos/:photoId',
    allow: 'admin head foreman:own',
    allowed: 404,
    call: (c) => c.agent.get(`/api/fields/${c.ids.field}/checks/${c.ids.check}/photos/999999`),
  },
  { route: 'GET /api/fields/:id/growth-calibration', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/growth-calibration`) },
  { route: 'GET /api/fields/:id/work', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/work`) },
  { route: 'GET /api/fields/:id/needs', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/needs`) },
  { route: 'GET /api/fields/:id/closures', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/closures`) },
  {
    route: 'POST /api/fields/:id/closures',
    allow: 'admin head foreman:own',
    call: (c) => c.agent.post(`/api/fields/${c.ids.field}/closures`).send({ version: STALE, status: 'closed', reason: 'wet' }),
  },
  { route: 'POST /api/fields/:id/reopen', allow: 'admin head foreman:own', call: (c) => c.agent.post(`/api/fields/${c.ids.field}/reopen`).send({ version: STALE }) },
  { route: 'GET /api/fields/:id/stripes', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/stripes`) },
  {
    route: 'PATCH /api/fields/:id/stripes',
    allow: 'admin head foreman:own',
    call: (c) => c.agent.patch(`/api/fields/${c.ids.field}/stripes`).send({ pattern: 'lengthwise', version: STALE }),
  },

  // Bookings
  { route: 'GET /api/field-events', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/field-events') },
  {
    route: 'POST /api/field-events',
    allow: 'admin foreman:own partner:own',
    call: (c) => c.agent.post('/api/field-events').send({ fieldId: c.ids.field, kind: 'practice', title: 'Matrix practice', startsOn: '2030-02-01' }),
  },
  {
    route: 'PATCH /api/field-events/:id',
    allow: 'admin foreman:own partner:own',
    call: (c) => c.agent.patch(`/api/field-events/${c.ids.event}`).send({ version: STALE, notes: 'x' }),
  },
  { route: 'DELETE /api/field-events/:id', allow: 'admin foreman:own partner:own', call: (c) => c.agent.delete(`/api/field-events/${c.ids.event}?version=${STALE}`) },

  // Field requests
  { route: 'GET /api/requests', allow: 'admin head foreman partner', scoped: false, call: (c) => c.agent.get('/api/requests') },
  {
    route: 'POST /api/requests',
    allow: 'admin partner:own',
    call: (c) => c.agent.post('/api/requests').send({ fieldId: c.ids.field, kind: 'wet_area', description: 'Standing water by the north goal' }),
  },
  { route: 'GET /api/requests/:id', allow: 'admin head foreman:own partner:own', call: (c) => c.agent.get(`/api/requests/${c.ids.request}`) },
  {
    route: 'PATCH /api/requests/:id',
    allow: 'partner:own',
    // The other side's request was filed by an administrator, who may change his own: called on the partner's only.
    scoped: false,
    narrower: 'Only the partner who filed a request changes it; the department answers it with messages and decisions.',
    call: (c) => c.agent.patch(`/api/requests/${c.ids.request}`).send({ version: STALE, description: 'Changed words' }),
  },
  {
    route: 'POST /api/requests/:id/messages',
    allow: 'admin foreman:own partner:own',
    call: (c) => c.agent.post(`/api/requests/${c.ids.request}/messages`).send({ body: 'A word' }),
  },
  {
    route: 'POST /api/requests/:id/photos',
    allow: 'admin foreman:own partner:own',
    call: (c) => c.agent.post(`/api/requests/${c.ids.request}/photos`).attach('photo', PNG_1PX, 'p.png'),
  },
  {
    route: 'GET /api/requests/:id/photos/:photoId',
    allow: 'admin head foreman:own partner:own',
    allowed: 404,
    call: (c) => c.agent.get(`/api/requests/${c.ids.request}/photos/999999`),
  },
  {
    route: 'POST /api/requests/:id/schedule',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post(`/api/requests/${c.ids.request}/schedule`).send({ version: STALE, work: { task: 'mow', plannedDate: '2030-01-08', plannedHours: 1 } }),
  },
  {
    route: 'POST /api/requests/:id/decline',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post(`/api/requests/${c.ids.request}/decline`).send({ version: STALE, reason: 'Not this week' }),
  },
  { route: 'POST /api/requests/:id/close', allow: 'admin foreman:own', call: (c) => c.agent.post(`/api/requests/${c.ids.request}/close`).send({ version: STALE }) },

  // Standards and settings
  { route: 'GET /api/standards', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/standards') },
  { route: 'PATCH /api/standards/:level', allow: 'admin head', scoped: false, call: (c) => c.agent.patch('/api/standards/3').send({ version: STALE, targetScore: 70 }) },
  { route: 'GET /api/settings', allow: 'admin', scoped: false, call: (c) => c.agent.get('/api/settings') },
  { route: 'PATCH /api/settings', allow: 'admin', scoped: false, call: (c) => c.agent.patch('/api/settings').send({ version: STALE, timeZone: 'America/Chicago' }) },

  // Imports
  { route: 'GET /api/imports', allow: 'admin head foreman', scoped: false, call: (c) => c.agent.get('/api/imports') },
  {
    route: 'POST /api/imports',
    allow: 'admin head foreman',
    scoped: false,
    call: (c) => c.agent.post('/api/imports').field('kind', 'sites_csv').attach('file', Buffer.from('name,district\n'), 'sites.csv'),
  },
  {
    route: 'GET /api/imports/:id',
    allow: 'admin head foreman:own',
    narrower: 'a foreman reads only the imports of his district',
    call: (c) => c.agent.get(`/api/imports/${c.ids.importId}`) },
  {
    route: 'POST /api/imports/:id/commit',
    allow: 'foreman:own',
   
    narrower: 'only the person who uploaded an import commits or undoes it',
    call: (c) => c.agent.post(`/api/imports/${c.ids.importId}/commit`) },
  {
    route: 'POST /api/imports/:id/undo',
    allow: 'foreman:own',
   
    narrower: 'only the person who uploaded an import commits or undoes it',
    call: (c) => c.agent.post(`/api/imports/${c.ids.importId}/undo`) },

  // Map, directory, crews, equipment
  { route: 'GET /api/map', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/map') },
  { route: 'GET /api/map/basemap', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/map/basemap') },
  { route: 'GET /api/districts', allow: 'admin head foreman crew', scoped: false, call: (c) => c.agent.get('/api/districts') },
  { route: 'GET /api/audit', allow: 'admin head foreman', scoped: false, call: (c) => c.agent.get('/api/audit') },
  { route: 'GET /api/crews', allow: 'admin head foreman crew', scoped: false, call: (c) => c.agent.get('/api/crews') },
  {
    route: 'POST /api/crews',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/crews').send({ districtId: c.ids.district, name: `Matrix Crew ${c.n}`, hoursPerDay: 8 }),
  },
  { route: 'PATCH /api/crews/:id', allow: 'admin foreman:own', call: (c) => c.agent.patch(`/api/crews/${c.ids.crew}`).send({ version: STALE, hoursPerDay: 7 }) },
  { route: 'DELETE /api/crews/:id', allow: 'admin foreman:own', call: (c) => c.agent.delete(`/api/crews/${c.ids.crew}?version=${STALE}`) },
  { route: 'GET /api/equipment', allow: 'admin head foreman crew', scoped: false, call: (c) => c.agent.get('/api/equipment') },
  {
    route: 'POST /api/equipment',
    allow: 'admin foreman:own',
    call: (c) => c.agent.post('/api/equipment').send({ districtId: c.ids.district, kind: 'spreader', name: `Matrix spreader ${c.n}` }),
  },
  { route: 'PATCH /api/equipment/:id', allow: 'admin foreman:own', call: (c) => c.agent.patch(`/api/equipment/${c.ids.equipment}`).send({ version: STALE, notes: 'x' }) },
  { route: 'DELETE /api/equipment/:id', allow: 'admin foreman:own', call: (c) => c.agent.delete(`/api/equipment/${c.ids.equipment}?version=${STALE}`) },

  // Partner pages and calendar feeds
  { route: 'GET /api/partner/fields', allow: 'admin partner', scoped: false, call: (c) => c.agent.get('/api/partner/fields') },
  {
    route: 'GET /api/partner/fields/:id',
    allow: 'admin partner:own',
    narrower: 'a partner reads only the fields of his sites',
    call: (c) => c.agent.get(`/api/partner/fields/${c.ids.field}`) },
  {
    route: 'GET /api/partner/fields/:id/photos/:photoId',
    allow: 'admin partner:own',
    narrower: 'a partner reads only the fields of his sites',
   
    allowed: 404,
    call: (c) => c.agent.get(`/api/partner/fields/${c.ids.field}/photos/999999`),
  },
  { route: 'GET /api/calendar-feeds', allow: 'admin foreman partner', scoped: false, call: (c) => c.agent.get('/api/calendar-feeds') },
  {
    route: 'DELETE /api/calendar-feeds/:id',
    allow: 'admin partner:own',
    call: async (c) => {
      const [feed] = await c.db
        .insert(calendarFeeds)
        .values({ ...c.ids.feedOwner, tokenHash: crypto.randomBytes(16).toString('hex') })
        .returning({ id: calendarFeeds.id });
      return c.agent.delete(`/api/calendar-feeds/${feed!.id}`);
    },
  },
  { route: 'POST /api/calendar-feeds', allow: 'admin foreman:own', call: (c) => c.agent.post('/api/calendar-feeds').send({ crewId: c.ids.crew }) },

  // Developer mail sink (only beside the local sink, never in production)
  { route: 'GET /api/dev/mail', allow: 'admin', scoped: false, call: (c) => c.agent.get('/api/dev/mail') },
  { route: 'DELETE /api/dev/mail', allow: 'admin', scoped: false, call: (c) => c.agent.delete('/api/dev/mail') },

  // The mail outbox: the head sees stuck e-mail and sends a failed one again
  { route: 'GET /api/mail-outbox', allow: 'admin head', scoped: false, call: (c) => c.agent.get('/api/mail-outbox') },
  {
    route: 'POST /api/mail-outbox/:id/retry',
    allow: 'admin head',
    scoped: false,
    call: async (c) => {
      const [mail] = await c.db
        .insert(mailOutbox)
        .values({ to: `matrix${c.n}@test.example`, subject: 'Matrix', text: 'x', status: 'failed', attempts: 20, lastError: 'refused' })
        .returning({ id: mailOutbox.id });
      return c.agent.post(`/api/mail-outbox/${mail!.id}/retry`);
    },
  },

  // Costs and rates
  { route: 'GET /api/costs', allow: 'admin head foreman', scoped: false, call: (c) => c.agent.get('/api/costs') },
  { route: 'PATCH /api/costs', allow: 'admin head', scoped: false, call: (c) => c.agent.patch('/api/costs').send({ ...DEFAULT_COSTS, version: STALE }) },

  // Season budget: the head sets it; a foreman reads his district's
  { route: 'GET /api/budget', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/budget?season=2026&districtId=${c.ids.district}`) },
  { route: 'GET /api/budget/export.csv', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/budget/export.csv?season=2026&districtId=${c.ids.district}`) },
  { route: 'GET /api/budget/report.pdf', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/budget/report.pdf?season=2026&districtId=${c.ids.district}`) },
  {
    route: 'PATCH /api/budget/line',
    allow: 'admin head',
    call: (c) => c.agent.patch('/api/budget/line').send({ season: 2026, districtId: c.ids.district, line: 'labour', amount: 1000, version: STALE }),
  },
  { route: 'POST /api/what-if', allow: 'admin head foreman:own', call: (c) => c.agent.post('/api/what-if').send({ season: 2026, districtId: c.ids.district, moves: [{ fieldId: c.ids.field, level: 4 }] }) },
  // Saved what-ifs: a foreman's are his district's; only the one who saved a scenario removes it.
  { route: 'GET /api/what-if/scenarios', allow: 'admin head foreman', scoped: false, call: (c) => c.agent.get('/api/what-if/scenarios') },
  {
    route: 'POST /api/what-if/scenarios',
    allow: 'admin head foreman:own',
    call: (c) => c.agent.post('/api/what-if/scenarios').send({ name: `Matrix ${c.n}`, change: { season: 2026, districtId: c.ids.district, moves: [{ fieldId: c.ids.field, level: 4 }] } }),
  },
  {
    route: 'GET /api/what-if/scenarios/compare',
    allow: 'admin head foreman:own',
    call: async (c) => {
      const change = { season: 2026, districtId: c.ids.district, moves: [{ fieldId: c.ids.field, level: 3 }] };
      const saved = await c.db.insert(whatIfScenarios).values([1, 2].map((k) => ({ name: `Matrix ${c.n}.${k}`, season: 2026, districtId: c.ids.district, change }))).returning({ id: whatIfScenarios.id });
      return c.agent.get(`/api/what-if/scenarios/compare?ids=${saved.map((s) => s.id).join(',')}`);
    },
  },
  {
    route: 'DELETE /api/what-if/scenarios/:id',
    allow: 'admin head foreman:own',
    call: async (c) => {
      // Saved by the caller, so only the scope decides.
      const me = (await c.agent.get('/api/auth/me')).body as { user?: { id: number } };
      const [saved] = await c.db
        .insert(whatIfScenarios)
        .values({ name: `Matrix ${c.n}`, season: 2026, districtId: c.ids.district, change: { season: 2026, districtId: c.ids.district, moves: [] }, createdBy: me.user?.id ?? null })
        .returning({ id: whatIfScenarios.id });
      return c.agent.delete(`/api/what-if/scenarios/${saved!.id}`);
    },
  },
  // Sites compared
  { route: 'GET /api/compare/sites', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/compare/sites?districtId=${c.ids.district}`) },
  { route: 'GET /api/compare/sites.csv', allow: 'admin head foreman:own', call: (c) => c.agent.get(`/api/compare/sites.csv?districtId=${c.ids.district}`) },

  // Cultural work: application records
  { route: 'GET /api/records/applications', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/records/applications') },
  {
    route: 'POST /api/work-orders/:id/application',
    allow: 'admin foreman:own crew:own',
    call: (c) => c.agent.post(`/api/work-orders/${c.ids.workOrder}/application`).send({ product: 'x' }),
  },

  // Line plans
  { route: 'GET /api/fields/:id/lines', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/lines`) },
  { route: 'GET /api/fields/:id/lines/set-out.pdf', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/lines/set-out.pdf`) },
  { route: 'PATCH /api/fields/:id/lines', allow: 'admin head foreman:own', call: (c) => c.agent.patch(`/api/fields/${c.ids.field}/lines`).send({ version: STALE }) },

  // Logos (no logo exists: an allowed caller is told the logo is missing)
  { route: 'GET /api/fields/:id/logos', allow: 'admin head foreman:own crew:own partner:own', call: (c) => c.agent.get(`/api/fields/${c.ids.field}/logos`) },
  { route: 'POST /api/fields/:id/logos', allow: 'admin head foreman:own', call: (c) => c.agent.post(`/api/fields/${c.ids.field}/logos`).attach('logo', PNG_1PX, 'logo.png') },
  {
    route: 'PATCH /api/fields/:id/logos/:logoId',
    allow: 'admin head foreman:own',
    allowed: 404,
    call: (c) => c.agent.patch(`/api/fields/${c.ids.field}/logos/999999`).send({ version: STALE, widthM: 5 }),
  },
  { route: 'DELETE /api/fields/:id/logos/:logoId', allow: 'admin head foreman:own', allowed: 404, call: (c) => c.agent.delete(`/api/fields/${c.ids.field}/logos/999999?version=${STALE}`) },
  { route: 'GET /api/fields/:id/logos/:logoId/image', allow: 'admin head foreman:own crew:own partner:own', allowed: 404, call: (c) => c.agent.get(`/api/fields/${c.ids.field}/logos/999999/image`) },
  { route: 'GET /api/fields/:id/logos/:logoId/grid.pdf', allow: 'admin head foreman:own crew:own partner:own', allowed: 404, call: (c) => c.agent.get(`/api/fields/${c.ids.field}/logos/999999/grid.pdf`) },

  // Game-day preparations
  { route: 'GET /api/game-days', allow: 'everyone', scoped: false, call: (c) => c.agent.get('/api/game-days') },
  { route: 'GET /api/game-days/:id', allow: 'everyone', scoped: false, allowed: 404, call: (c) => c.agent.get('/api/game-days/999999') },
  { route: 'GET /api/game-days/:id/checklist.pdf', allow: 'everyone', scoped: false, allowed: 404, call: (c) => c.agent.get('/api/game-days/999999/checklist.pdf') },
  { route: 'POST /api/game-days/events/:eventId', allow: 'admin foreman:own', call: (c) => c.agent.post(`/api/game-days/events/${c.ids.event}`).send({ steps: 'none' }) },
];

export type Caller = 'anonymous' | Role;
export type Scope = 'own' | 'other';

/** What the row expects of a caller on a scope: 'allow', 401 (signed out) or the refusal. */
export function expected(row: MatrixRow, caller: Caller, scope: Scope): 'allow' | 'deny' | 401 {
  if (row.allow === 'public') return 'allow';
  if (caller === 'anonymous') return 401;
  if (row.allow === 'everyone') return 'allow';
  for (const word of row.allow.split(/\s+/)) {
    const [role, limit] = word.split(':');
    if (role === caller && (limit === undefined || scope === 'own')) return 'allow';
  }
  return 'deny';
}
