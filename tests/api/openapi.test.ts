import { compileErrors, dereference, validate } from '@readme/openapi-parser';
import { Ajv2020 } from 'ajv/dist/2020.js';
import express, { Router, type Express } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import supertest from 'supertest';
import { ERROR_CODES } from '@swardwise/domain';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { COOKIE_NAME } from '../../apps/api/src/app.ts';
import { buildOpenApiDocument, openApiPath } from '../../apps/api/src/openapi/document.ts';
import { servedRoutes } from '../support/routes.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
let served: OpenAPIV3_1.Document;

beforeAll(async () => {
  api = await startTestApi();
  served = (await supertest(api.app).get('/api/openapi.json')).body as OpenAPIV3_1.Document;
});
afterAll(() => api.close());

/** `METHOD /api/x/:id` for every operation of the document. */
function documentedRoutes(doc: OpenAPIV3_1.Document): string[] {
  return Object.entries(doc.paths ?? {})
    .flatMap(([path, item]) =>
      ['get', 'post', 'put', 'patch', 'delete'].filter((m) => item && m in item).map((m) => `${m.toUpperCase()} ${path.replace(/\{([^}]+)\}/g, ':$1')}`),
    )
    .sort();
}

/** What the document lacks and what it lists in vain, as a message naming each route. */
function compare(app: Express, doc: OpenAPIV3_1.Document) {
  const apiRoutes = servedRoutes(app).filter((r) => / \/api(\/|$)/.test(r));
  const documented = documentedRoutes(doc);
  const missing = apiRoutes.filter((r) => !documented.includes(r));
  const extra = documented.filter((r) => !apiRoutes.includes(r));
  const message = [
    missing.length ? `Served but missing from the OpenAPI document (add them to apps/api/src/openapi/routes.ts):\n  ${missing.join('\n  ')}` : '',
    extra.length ? `In the OpenAPI document but not served by the app (remove them from apps/api/src/openapi/routes.ts):\n  ${extra.join('\n  ')}` : '',
  ]
    .filter(Boolean)
    .join('\n');
  return { apiRoutes, missing, extra, message };
}

describe('GET /api/openapi.json', () => {
  test('should be served without signing in, as JSON', async () => {
    const res = await supertest(api.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.type).toBe('application/json');
    expect(res.body.openapi).toBe('3.1.0');
    expect(res.body.info.title).toBe('Swardwise API');
  });

  test('should be a valid OpenAPI 3.1 document', async () => {
    const result = await validate(structuredClone(served) as never);
    expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true);
    expect(result.warnings).toEqual([]);
  });

  test('should document every route the app serves, and no other', () => {
    const { apiRoutes, missing, extra, message } = compare(api.app, served);
    // The walker must have reached the nested routers, or an empty comparison would pass.
    expect(apiRoutes).toContain('GET /api/work-orders/:id/photos/:photoId');
    expect(apiRoutes).toContain('GET /api/districts');
    expect(apiRoutes.length).toBeGreaterThan(50);
    expect({ missing, extra }, message).toEqual({ missing: [], extra: [] });
  });

  test('should leave out the development routes when production does not serve them', () => {
    const production = buildOpenApiDocument({ dev: false, cookieName: COOKIE_NAME });
    expect(Object.keys(production.paths ?? {}).filter((p) => p.startsWith('/api/dev'))).toEqual([]);
    expect(Object.keys(served.paths ?? {})).toContain('/api/dev/mail');
  });
});

describe('route comparison', () => {
  test('should name a served route the document lacks, and a documented route nobody serves', () => {
    const app = express();
    const things = Router();
    things.get('/:id/parts/:partId', (_req, res) => void res.end());
    app.use('/api/things', things);
    app.get('/api/openapi.json', (_req, res) => void res.end());
    const doc = { openapi: '3.1.0', info: { title: 't', version: '1' }, paths: { '/api/openapi.json': { get: {} }, '/api/gone': { delete: {} } } } as unknown as OpenAPIV3_1.Document;
    const { missing, extra, message } = compare(app, doc);
    expect(missing).toEqual(['GET /api/things/:id/parts/:partId']);
    expect(extra).toEqual(['DELETE /api/gone']);
    expect(message).toContain('missing from the OpenAPI document');
    expect(message).toContain('  GET /api/things/:id/parts/:partId');
  });

  test('should turn Express parameters into OpenAPI templates', () => {
    expect(openApiPath('/api/work-orders/:id/photos/:photoId')).toBe('/api/work-orders/{id}/photos/{photoId}');
  });
});

describe('the operations', () => {
  const operations = () =>
    Object.entries(served.paths ?? {}).flatMap(([path, item]) =>
      Object.entries(item ?? {}).map(([method, op]) => ({ route: `${method.toUpperCase()} ${path}`, op: op as OpenAPIV3_1.OperationObject & { 'x-swardwise-access': { kind: string; roles: { role: string; scope: string[] }[] } } })),
    );

  test('should say who may call each route, from the shared abilities', () => {
    for (const { route, op } of operations()) {
      expect(op.description, route).toMatch(/^Who: /);
      expect(op['x-swardwise-access'], route).toBeDefined();
    }
    const field = served.paths!['/api/fields/{id}']!.patch as never as { description: string; 'x-swardwise-access': { roles: unknown[] } };
    expect(field.description).toContain('Who: Administrator; Department head; District foreman (own district).');
    expect(field['x-swardwise-access'].roles).toEqual([
      { role: 'admin', scope: [] },
      { role: 'head', scope: [] },
      { role: 'foreman', scope: ['own district'] },
    ]);
    expect((served.paths!['/api/users']!.get as { description: string }).description).toBe('Who: Administrator; District foreman (own district).');
    expect((served.paths!['/api/week-plans']!.get as { description: string }).description).not.toContain('Crew lead');
  });

  test('should state for every photo upload the image types the server reads, and no other', () => {
    const uploads = operations().filter(({ op }) => (op.requestBody as OpenAPIV3_1.RequestBodyObject | undefined)?.content?.['multipart/form-data']);
    expect(uploads.length).toBeGreaterThanOrEqual(4);
    for (const { route, op } of uploads) {
      const encoding = (op.requestBody as OpenAPIV3_1.RequestBodyObject).content['multipart/form-data']!.encoding!;
      const types = Object.values(encoding).map((e) => e.contentType);
      if (!/photos/.test(route)) continue;
      // What the upload check lets through (services/work-photos.ts readImage); any other image is refused with 415.
      expect(types, route).toEqual(['image/jpeg, image/png, image/webp']);
    }
  });

  test('should mark public routes as needing no session, and the others as needing one', () => {
    const open = operations()
      .filter(({ op }) => op.security?.length === 0)
      .map(({ route }) => route)
      .sort();
    expect(open).toEqual([
      'GET /api/calendar/{token}.ics',
      'GET /api/config',
      'GET /api/health',
      'GET /api/openapi.json',
      'GET /api/public/status',
      'POST /api/auth/accept-invite',
      'POST /api/auth/forgot-password',
      'POST /api/auth/reset-password',
      'POST /api/auth/sign-in',
      'POST /api/auth/sign-out',
    ]);
    expect(served.security).toEqual([{ session: [] }]);
    expect(served.components?.securitySchemes?.session).toMatchObject({ type: 'apiKey', in: 'cookie', name: COOKIE_NAME });
  });

  test('should describe bodies, parameters and uploads from the schemas the routes parse with', () => {
    const patchField = served.paths!['/api/fields/{id}']!.patch!;
    expect(patchField.parameters).toEqual([expect.objectContaining({ in: 'path', name: 'id', required: true, schema: expect.objectContaining({ type: 'integer' }) })]);
    expect(patchField.requestBody).toMatchObject({ content: { 'application/json': { schema: { $ref: '#/components/schemas/UpdateField' } } } });
    const updateField = served.components!.schemas!.UpdateField!;
    expect(updateField.required).toEqual(['version']);
    expect(Object.keys(updateField.properties!)).toEqual(expect.arrayContaining(['name', 'maintenanceLevel', 'geometry', 'version']));

    const upload = served.paths!['/api/imports']!.post!.requestBody as OpenAPIV3_1.RequestBodyObject;
    const form = upload.content['multipart/form-data']!;
    expect(form.schema).toMatchObject({ required: ['kind', 'file'], properties: { kind: { enum: ['sites_csv', 'fields_csv', 'outlines_geojson'] }, file: { type: 'string', format: 'binary' } } });

    const days = served.paths!['/api/weather/stations/{id}/days']!.get!.parameters as OpenAPIV3_1.ParameterObject[];
    expect(days.map((p) => `${p.in}:${p.name}:${p.required}`)).toEqual(['path:id:true', 'query:from:true', 'query:to:true']);
  });

  test('should answer failures with the one error shape', () => {
    const bad = served.components!.responses!.BadRequest as OpenAPIV3_1.ResponseObject;
    expect(bad.content!['application/json']!.schema).toEqual({ $ref: '#/components/schemas/ErrorBody' });
    const errorBody = served.components!.schemas!.ErrorBody!;
    expect(errorBody.required).toEqual(['error']);
    expect((errorBody.properties!.error as OpenAPIV3_1.SchemaObject).required).toEqual(['code', 'message']);
    const code = (errorBody.properties!.error as OpenAPIV3_1.SchemaObject).properties!.code as OpenAPIV3_1.SchemaObject;
    expect((code.anyOf![0] as OpenAPIV3_1.SchemaObject).enum).toEqual(Object.keys(ERROR_CODES));
    for (const { route, op } of operations()) {
      expect(op.responses?.['500'], route).toEqual({ $ref: '#/components/responses/ServerError' });
      if (op.security?.length !== 0) expect(op.responses?.['401'], route).toEqual({ $ref: '#/components/responses/Unauthenticated' });
      if (route.includes('{')) expect(op.responses?.['404'], route).toEqual({ $ref: '#/components/responses/NotFound' });
    }
  });
});

describe('the documented answers', () => {
  let resolved: OpenAPIV3_1.Document | undefined;
  /** Checks a real answer against the schema the document gives for its status. */
  async function conforms(agent: ReturnType<typeof supertest.agent>, method: 'get', path: string, url: string) {
    resolved ??= (await dereference(structuredClone(served) as never)) as OpenAPIV3_1.Document;
    const doc = resolved;
    const res = await agent[method](url);
    const answer = doc.paths![path]![method]!.responses![`${res.status}`] as OpenAPIV3_1.ResponseObject | undefined;
    expect(answer, `${url} answered ${res.status}, which the document does not list: ${JSON.stringify(res.body).slice(0, 300)}`).toBeDefined();
    const schema = answer!.content?.['application/json']?.schema;
    if (!schema) return res.status;
    const ajv = new Ajv2020({ strict: false, validateFormats: false, allErrors: true });
    const check = ajv.compile(schema);
    expect(check(res.body), `${url} (${res.status}): ${ajv.errorsText(check.errors)}`).toBe(true);
    return res.status;
  }

  test('should match what the API sends to a signed-in head, foreman and administrator', async () => {
    const { fixture } = api;
    const head = await api.signIn('head');
    const foreman = await api.signIn('foreman');
    const admin = await api.signIn('admin');
    const anonymous = supertest.agent(api.app);
    const monday = '2026-06-01';
    type Agent = ReturnType<typeof supertest.agent>;
    // Paths that are their own URL: who asks, the status expected, the paths.
    const plain: [Agent, number, string[]][] = [
      [anonymous, 200, ['/api/health', '/api/openapi.json']],
      [anonymous, 401, ['/api/auth/me']],
      [head, 200, ['/api/auth/me', '/api/weather/stations', '/api/sites', '/api/fields', '/api/field-events', '/api/standards', '/api/imports', '/api/map', '/api/map/basemap', '/api/districts', '/api/audit']],
      [head, 403, ['/api/users']],
      [admin, 200, ['/api/users', '/api/dev/mail']],
      [foreman, 200, ['/api/work-orders', '/api/crews', '/api/equipment']],
    ];
    // Paths with parameters or a query: who asks, the documented path, the URL asked for, the status expected.
    const templated: [Agent, string, string, number][] = [
      [head, '/api/weather/stations/{id}/days', `/api/weather/stations/${fixture.weather.stationId}/days?from=${fixture.weather.start}&to=${fixture.weather.end}`, 200],
      [head, '/api/weather/stations/{id}/days', `/api/weather/stations/${fixture.weather.stationId}/days?from=2026-02-30&to=2026-03-01`, 400],
      [foreman, '/api/week-plans', `/api/week-plans?districtId=${fixture.districts.north}&weekStart=${monday}`, 200],
      [head, '/api/records', `/api/records?from=2026-05-01&to=2026-06-30`, 200],
      [head, '/api/sites/{id}', `/api/sites/${fixture.sites.northPark}`, 200],
      [head, '/api/sites/{id}', '/api/sites/999999', 404],
      [head, '/api/fields/{id}', `/api/fields/${fixture.fields.northSoccer}`, 200],
    ];
    const checks = [...plain.flatMap(([agent, status, paths]) => paths.map((path) => [agent, path, path, status] as const)), ...templated];
    for (const [agent, path, url, status] of checks) {
      expect(await conforms(agent, 'get', path, url), url).toBe(status);
    }
  });
});
