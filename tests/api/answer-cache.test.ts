import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { addCrew, addUser, giveWork } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

/**
 * The field list and the map are cached per caller scope. Two crews of one district have
 * different scopes (each sees the fields of its own work), so one's answer must never be
 * served to the other, whichever asks first.
 */
let api: TestApi;
let crewA: { id: number; email: string };
let crewB: { id: number; email: string };

beforeAll(async () => {
  api = await startTestApi();
  const { db } = api.database;
  const { districts, fields } = api.fixture;
  const a = await addCrew(db, districts.north, 'North Crew A');
  const b = await addCrew(db, districts.north, 'North Crew B');
  crewA = await addUser(db, 'crewLeadA', 'crew', { districtId: districts.north, crewId: a });
  crewB = await addUser(db, 'crewLeadB', 'crew', { districtId: districts.north, crewId: b });
  await giveWork(db, fields.northSoccer, a, 1);
  await giveWork(db, fields.northLawn, b, 1);
});
afterAll(() => api.close());

type Route = '/api/fields' | '/api/map';
const fieldIds = (route: Route, body: { items?: { id: number }[]; fields?: { id: number }[] }) => (route === '/api/fields' ? body.items! : body.fields!).map((f) => f.id).sort((x, y) => x - y);

describe('cached answers of the field list and the map', () => {
  test.each([
    ['/api/fields', 'A first'],
    ['/api/fields', 'B first'],
    ['/api/map', 'A first'],
    ['/api/map', 'B first'],
  ] as [Route, string][])('should give each crew of one district only its own fields on %s (%s)', async (route, order) => {
    // A write the crews do not see, so this round starts with an empty cache for the data.
    await giveWork(api.database.db, api.fixture.fields.southBaseball, api.fixture.crews.south, 1);
    const agentA = await api.signInAs(crewA.email);
    const agentB = await api.signInAs(crewB.email);
    const expected = { A: [api.fixture.fields.northSoccer], B: [api.fixture.fields.northLawn] };
    const turns = order === 'A first' ? ([['A', agentA], ['B', agentB]] as const) : ([['B', agentB], ['A', agentA]] as const);
    for (const [who, agent] of turns) {
      const res = await agent.get(route);
      expect(res.status, who).toBe(200);
      expect(fieldIds(route, res.body), `crew ${who} after ${order}`).toEqual(expected[who]);
    }
  });
});
