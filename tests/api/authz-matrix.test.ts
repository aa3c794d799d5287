/**
 * The authorization matrix: every route the app serves, called as every role and signed out,
 * on rows of the caller's own district / site / crew and of another, answers as the matrix
 * (tests/support/route-matrix.ts) says. A served route missing from the matrix fails.
 */
import supertest from 'supertest';
import { defineAbilityFor } from '@swardwise/domain';
import { beforeAll, describe, expect, test } from 'vitest';
import { equipment, fieldRequests, imports } from '../../apps/api/src/db/schema/index.ts';
import { ROUTES } from '../../apps/api/src/openapi/routes.ts';
import { useTestApi } from '../support/app.ts';
import { giveWork } from '../support/fixture.ts';
import { CHECK, expected, MATRIX, type Agent, type Caller, type MatrixRow, type Scope, type ScopeIds } from '../support/route-matrix.ts';
import { servedRoutes } from '../support/routes.ts';

const api = useTestApi();
const CALLERS: Caller[] = ['anonymous', 'admin', 'head', 'foreman', 'crew', 'partner'];
const SIGNED_IN = { admin: 'admin', head: 'head', foreman: 'foreman', crew: 'crew', partner: 'partner' } as const;

let agents: Record<Caller, Agent>;
let scopes: Record<Scope, ScopeIds>;

async function setUp(): Promise<void> {
  const { db } = api.database;
  const f = api.fixture;
  agents = { anonymous: supertest.agent(api.app) } as Record<Caller, Agent>;
  for (const role of Object.keys(SIGNED_IN) as (keyof typeof SIGNED_IN)[]) agents[role] = await api.signIn(role);
  const admin = agents.admin;

  const ownOrder = await giveWork(db, f.fields.northSchoolFootball, f.crews.north, 0);
  const otherOrder = await giveWork(db, f.fields.southBaseball, f.crews.south, 0);
  const [ownKit, otherKit] = await db
    .insert(equipment)
    .values([
      { districtId: f.districts.north, crewId: f.crews.north, kind: 'spreader', name: 'North spreader' },
      { districtId: f.districts.south, crewId: f.crews.south, kind: 'spreader', name: 'South spreader' },
    ])
    .returning({ id: equipment.id });
  const event = async (agent: Agent, fieldId: number) => {
    const res = await agent.post('/api/field-events').send({ fieldId, kind: 'game', title: 'Matrix game', startsOn: '2030-03-01' });
    if (res.status !== 201) throw new Error(`booking: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.event.id as number;
  };
  const check = async (fieldId: number) => {
    const res = await admin.post(`/api/fields/${fieldId}/checks`).send(CHECK);
    if (res.status !== 201) throw new Error(`check: ${res.status} ${JSON.stringify(res.body)}`);
    return (res.body.check?.id ?? res.body.id) as number;
  };
  const filed = await agents.partner.post('/api/requests').send({ fieldId: f.fields.northSchoolFootball, kind: 'wet_area', description: 'Standing water by the goal' });
  if (filed.status !== 201) throw new Error(`request: ${filed.status} ${JSON.stringify(filed.body)}`);
  const ownRequest = (filed.body.request?.id ?? filed.body.id) as number;
  const [otherRequest] = await db
    .insert(fieldRequests)
    .values({ fieldId: f.fields.southBaseball, siteId: f.sites.southPark, districtId: f.districts.south, kind: 'wet_area', description: 'Puddles', createdBy: f.users.admin.id })
    .returning({ id: fieldRequests.id });
  const importRow = (userId: number, districtId: number) => ({ kind: 'sites_csv' as const, userId, districtId, fileName: 'sites.csv', rows: [], summary: { create: 0, update: 0, errors: 0 } as never });
  const [ownImport, otherImport] = await db
    .insert(imports)
    .values([importRow(f.users.foreman.id, f.districts.north), importRow(f.users.foremanSouth.id, f.districts.south)])
    .returning({ id: imports.id });
  const feed = async (agent: Agent, body: object) => {
    const res = await agent.post('/api/calendar-feeds').send(body);
    if (res.status !== 201 && res.status !== 200) throw new Error(`feed: ${res.status} ${JSON.stringify(res.body)}`);
    const url = JSON.stringify(res.body).match(/calendar\/([A-Za-z0-9_-]{20,100})\.ics/);
    if (!url) throw new Error(`feed without an address: ${JSON.stringify(res.body)}`);
    return url[1]!;
  };

  scopes = {
    own: {
      district: f.districts.north,
      site: f.sites.northSchool,
      field: f.fields.northSchoolFootball,
      crew: f.crews.north,
      workOrder: ownOrder,
      equipment: ownKit!.id,
      event: await event(agents.partner, f.fields.northSchoolFootball),
      request: ownRequest,
      check: await check(f.fields.northSchoolFootball),
      importId: ownImport!.id,
      user: f.users.inactive.id,
      station: f.weather.stationId,
      feedToken: await feed(agents.partner, {}),
      feedOwner: { kind: 'partner', userId: f.users.partner.id },
    },
    other: {
      district: f.districts.south,
      site: f.sites.southPark,
      field: f.fields.southBaseball,
      crew: f.crews.south,
      workOrder: otherOrder,
      equipment: otherKit!.id,
      event: await event(admin, f.fields.southBaseball),
      request: otherRequest!.id,
      check: await check(f.fields.southBaseball),
      importId: otherImport!.id,
      user: f.users.foremanSouth.id,
      station: f.weather.stationId,
      feedToken: await feed(admin, { crewId: f.crews.south }),
      feedOwner: { kind: 'crew', crewId: f.crews.south, districtId: f.districts.south },
    },
  };
}

/** The answer as the matrix words it. */
function outcome(status: number, code: string | undefined, row: MatrixRow): 'allow' | 'deny' | 401 | number {
  if (status >= 500 && !(status === 503 && row.allowed === 503)) return status;
  if (status === 401) return status;
  if (status === 403) return 'deny';
  // An allowed 404 names the row behind the checked one (a photo, a logo, a preparation), never the checked row.
  if (status === 404) return row.allowed === 404 && /photo|field_logo|game_day/.test(code ?? '') ? 'allow' : 'deny';

  return 'allow';
}

const routeKey = (r: string) => r;

describe('authorization matrix', () => {
  beforeAll(setUp, 60_000);

  test('should list every route the app serves, and only those', () => {
    const served = servedRoutes(api.app).filter((r) => / \/api(\/|$)/.test(r));
    const listed = MATRIX.map((r) => routeKey(r.route));
    const missing = served.filter((r) => !listed.includes(r));
    const extra = listed.filter((r) => !served.includes(r));
    const duplicated = listed.filter((r, i) => listed.indexOf(r) !== i);
    const message = [
      missing.length
        ? `Served but missing from the matrix; add one row each to MATRIX in tests/support/route-matrix.ts:\n${missing
            .map((r) => `  { route: '${r}', allow: '<public | everyone | admin head foreman:own crew:own partner:own>', call: (c) => c.agent.${r.split(' ')[0]!.toLowerCase()}(\`${r.split(' ')[1]!.replace(/:(\w+)/g, '${c.ids.<$1>}')}\`) },`)
            .join('\n')}`
        : '',
      extra.length ? `In the matrix but not served (remove these rows):\n  ${extra.join('\n  ')}` : '',
      duplicated.length ? `Listed twice in the matrix:\n  ${duplicated.join('\n  ')}` : '',
    ]
      .filter(Boolean)
      .join('\n');
    expect(message).toBe('');
    // The walk finds the routers (a broken walk would find nothing and pass).
    expect(served.length).toBeGreaterThanOrEqual(90);
  });

  test('should agree with the abilities: a role the ability rules refuse is refused, one they allow on every row is let in', () => {
    const disagreements: string[] = [];
    for (const route of ROUTES) {
      if (route.access.kind !== 'ability') continue;
      const key = `${route.method.toUpperCase()} ${route.path}`;
      const row = MATRIX.find((r) => r.route === key);
      if (!row || row.narrower) continue;
      const access = route.access;
      for (const role of Object.keys(SIGNED_IN) as (keyof typeof SIGNED_IN)[]) {
        const ability = defineAbilityFor({ id: 1, role, districtId: 1, crewId: 1, siteIds: [1] });
        const excepted = (access.except ?? []).includes(role);
        // On the subject type, `can` is true when some row of it may be acted on; a rule without
        // conditions lets the role act on every row.
        const some = ability.can(access.action, access.subject) && !excepted;
        const rule = ability.relevantRuleFor(access.action, access.subject);
        const every = some && rule !== null && !rule.inverted && !rule.conditions;
        const own = expected(row, role, 'own') === 'allow';
        const other = expected(row, role, 'other') === 'allow';
        if (own && !some) disagreements.push(`${key} as ${role}: the abilities refuse it, the matrix lets it in`);
        if (every && !row.narrower && !(own && other)) disagreements.push(`${key} as ${role}: the abilities allow it on every row, the matrix refuses some`);
      }
    }
    expect(disagreements).toEqual([]);
  });

  test('should answer every route as the matrix says, for every caller on own and other rows', async () => {
    const wrong: string[] = [];
    let calls = 0;
    let n = 0;
    for (const row of MATRIX) {
      for (const caller of CALLERS) {
        for (const scope of (row.scoped === false ? ['own'] : ['own', 'other']) as Scope[]) {
          const res = await row.call({
            agent: agents[caller],
            ids: scopes[scope],
            db: api.database.db,
            n: ++n,
            fresh: async () => (caller === 'anonymous' ? supertest.agent(api.app) : api.signIn(caller)),
          });
          calls++;
          const error = (res.body as { error?: { code?: string; message?: string } })?.error;
          const got = outcome(res.status, error?.code, row);
          const want = expected(row, caller, scope);
          if (got !== want) {
            wrong.push(`${row.route} as ${caller} on ${scope}: expected ${want}, got ${res.status} ${error ? `${error.code}: ${error.message}` : ''}`);
          }
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(calls).toBeGreaterThan(MATRIX.length * CALLERS.length);
  }, 120_000);
});
