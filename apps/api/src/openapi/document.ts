/**
 * The OpenAPI 3.1 document of the API, built with zod-openapi from the route table and the
 * shared zod schemas, for the department's IT (GIS and asset systems integrate over it).
 */
import type { RequestHandler } from 'express';
import { z } from 'zod';
import { createDocument, type oas31, type ZodOpenApiOperationObject, type ZodOpenApiPathsObject, type ZodOpenApiRequestBodyObject, type ZodOpenApiResponseObject } from 'zod-openapi';
import * as domain from '@swardwise/domain';
import pkg from '../../package.json' with { type: 'json' };
import { accessSentence, rolesOf } from './access.ts';
import { ERROR_ANSWERS, NAMED, errorBodySchema, type ErrorStatus } from './answers.ts';
import { ROUTES, type RouteDoc } from './routes.ts';

/** `/api/fields/:id` → `/api/fields/{id}`. */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:([A-Za-z_$][\w$]*)/g, '{$1}');
}

/** `post /api/work-orders/:id/photos` → `postWorkOrdersByIdPhotos`. */
function operationId(route: RouteDoc): string {
  const words = route.path
    .replace(/^\/api\//, '')
    .split(/[/.-]/)
    .filter(Boolean)
    .map((w) => (w.startsWith(':') ? `By${cap(w.slice(1))}` : cap(w)));
  return route.method + words.join('');
}
const cap = (w: string) => w.charAt(0).toUpperCase() + w.slice(1);

const ERROR_NAMES: Record<ErrorStatus, string> = {
  400: 'BadRequest',
  401: 'Unauthenticated',
  403: 'Forbidden',
  404: 'NotFound',
  409: 'Conflict',
  413: 'TooLarge',
  415: 'UnsupportedType',
  429: 'RateLimited',
  503: 'Unavailable',
  500: 'ServerError',
};

const errorResponses = Object.fromEntries(
  (Object.keys(ERROR_ANSWERS) as unknown as ErrorStatus[]).map((status) => [
    status,
    { id: ERROR_NAMES[status], description: ERROR_ANSWERS[status], content: { 'application/json': { schema: errorBodySchema } } } satisfies ZodOpenApiResponseObject,
  ]),
) as unknown as Record<ErrorStatus, ZodOpenApiResponseObject>;

/** The failures a route can answer with: those of its kind, and its own. */
function errorsOf(route: RouteDoc): ErrorStatus[] {
  const statuses = new Set<ErrorStatus>(route.errors ?? []);
  if (route.params || route.query || route.body || route.upload) statuses.add(400);
  if (route.body || route.upload) statuses.add(413);
  if (route.access.kind !== 'public') statuses.add(401);
  if (route.access.kind === 'ability') statuses.add(403);
  if (route.path.includes(':')) statuses.add(404);
  statuses.add(500);
  return [...statuses].sort((a, b) => a - b);
}

/** Request bodies named after their export from the domain, e.g. `createFieldSchema` → `CreateField`. */
function namedBodies(): Map<z.ZodType, string> {
  const used = new Set(ROUTES.flatMap((r) => [r.body, r.upload?.fields]).filter(Boolean));
  const names = new Map<z.ZodType, string>();
  for (const [name, value] of Object.entries(domain)) {
    if (value instanceof z.ZodType && used.has(value) && name.endsWith('Schema')) names.set(value, cap(name.slice(0, -'Schema'.length)));
  }
  return names;
}

function requestBody(route: RouteDoc): ZodOpenApiRequestBodyObject | undefined {
  if (route.body) return { required: true, content: { 'application/json': { schema: route.body } } };
  if (!route.upload) return undefined;
  const { file, fields, mediaTypes, maxBytes, description } = route.upload;
  const filePart = z.string().meta({ description, format: 'binary', 'x-max-bytes': maxBytes });
  const schema = (fields ?? z.object({})).extend({ [file]: filePart });
  return { required: true, content: { 'multipart/form-data': { schema, encoding: { [file]: { contentType: mediaTypes } } } } };
}

function operation(route: RouteDoc): ZodOpenApiOperationObject {
  const responses: ZodOpenApiOperationObject['responses'] = {};
  for (const answer of route.answers) {
    responses[`${answer.status}`] = {
      description: answer.description,
      ...(answer.body ? { content: { [answer.contentType ?? 'application/json']: { schema: answer.body } } } : {}),
    };
  }
  for (const status of errorsOf(route)) responses[`${status}`] = errorResponses[status];
  const params = { ...(route.params ? { path: route.params } : {}), ...(route.query ? { query: route.query } : {}) };
  const body = requestBody(route);
  return {
    operationId: operationId(route),
    summary: route.summary,
    description: [accessSentence(route.access), route.description].filter(Boolean).join('\n\n'),
    tags: [route.tag],
    ...(route.access.kind === 'public' ? { security: [] } : {}),
    'x-swardwise-access': { kind: route.access.kind, roles: rolesOf(route.access) },
    ...(Object.keys(params).length ? { requestParams: params } : {}),
    ...(body ? { requestBody: body } : {}),
    responses,
  };
}

const DESCRIPTION = `The API of Swardwise, the planning portal of the parks department, for the department's own systems (GIS, asset management).

- **Signing in.** Every route but the public ones needs a session: \`POST /api/auth/sign-in\` with an account's e-mail and password sets the session cookie; send it with each request. Ask the administrator for an account with the role the integration needs (a read-only integration: the department head role).
- **Who may do what** is written in each operation's description and in \`x-swardwise-access\` (roles, and the rows each is limited to), from the same abilities the server checks.
- **Units** are SI (mm, m, m², g/m², L, °C); **dates** are the department's local dates as \`YYYY-MM-DD\`; geometry is GeoJSON in WGS84, \`[longitude, latitude]\`.
- **Changes** send the \`version\` of the row they read; a stale version answers 409 and changes nothing.
- **Errors** all have one shape, \`ErrorBody\`: \`{ error: { code, message, details } }\`.`;

export interface DocumentOptions {
  /** Include the development-only routes (served only outside production, with the local mail sink). */
  dev: boolean;
  /** Name of the session cookie. */
  cookieName: string;
}

export function buildOpenApiDocument({ dev, cookieName }: DocumentOptions): oas31.OpenAPIObject {
  const paths: ZodOpenApiPathsObject = {};
  for (const route of ROUTES) {
    if (route.devOnly && !dev) continue;
    const path = openApiPath(route.path);
    paths[path] = { ...paths[path], [route.method]: operation(route) };
  }
  const schemas: Record<string, z.ZodType | oas31.SchemaObject> = { ErrorBody: errorBodySchema, ...NAMED };
  for (const [schema, name] of namedBodies()) schemas[name] = schema;
  return createDocument({
    openapi: '3.1.0',
    info: { title: 'Swardwise API', version: pkg.version, description: DESCRIPTION },
    security: [{ session: [] }],
    tags: [...new Set(ROUTES.filter((r) => dev || !r.devOnly).map((r) => r.tag))].map((name) => ({ name })),
    paths,
    components: {
      schemas,
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: cookieName, description: 'The session cookie set by `POST /api/auth/sign-in`.' } },
    },
  });
}

/** `GET /api/openapi.json`: public, since it describes routes and shapes and never data. Built once. */
export function serveOpenApi(options: DocumentOptions): RequestHandler {
  let document: oas31.OpenAPIObject | undefined;
  return (_req, res) => {
    document ??= buildOpenApiDocument(options);
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.json(document);
  };
}
