/**
 * Shapes of the API's answers for the OpenAPI document. The error shape is a zod schema
 * checked against the domain's `ErrorBody` type; success answers are described objects
 * until their zod schemas exist (an `Answer.body` takes either).
 */
import { z } from 'zod';
import type { oas31 } from 'zod-openapi';
import { ERROR_CODES, ROLES, UNIT_SYSTEMS, type ApiErrorCode, type ErrorBody } from '@swardwise/domain';

type Schema = oas31.SchemaObject;

/** `{ error: { code, message, details } }`, the one shape of every 4xx and 5xx answer. */
export const errorBodySchema = z.object({
  error: z.object({
    code: z
      .union([
        z.enum(Object.keys(ERROR_CODES) as [ApiErrorCode, ...ApiErrorCode[]]),
        z.templateLiteral(['engine/', z.string()]).meta({ description: 'A bad input to a turf computation (400)' }),
        z.templateLiteral(['geometry/', z.string()]).meta({ description: 'A field outline that is not a usable polygon (400)' }),
      ])
      .meta({
        description: 'Stable code namespaced by resource; the same code always means the same thing. Its status is fixed by the code.',
        examples: ['request/invalid', 'auth/unauthenticated', 'auth/forbidden', 'field/not_found', 'field/version_conflict'],
      }),
    message: z.string().meta({ description: 'What went wrong, in plain words for a person.' }),
    details: z
      .object({
        issues: z
          .array(
            z.object({
              path: z.string().meta({ description: 'Dotted path of the offending input, with the request part first', examples: ['body.email', 'query.from', 'params.id'] }),
              message: z.string(),
            }),
          )
          .optional()
          .meta({ description: 'One entry per bad input (answers with code `request/invalid` and some 400s of uploads)' }),
      })
      .catchall(z.unknown())
      .optional()
      .meta({ description: 'Absent when there is nothing more to say; some codes add their own keys (e.g. the rows of a bad station file).' }),
  }),
});

// The document must say what the API sends: this fails to compile when the two drift apart.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const errorShapeMatches: Same<z.output<typeof errorBodySchema>, ErrorBody> = true;
void errorShapeMatches;

/** The failures an operation can answer with, by HTTP status. */
export const ERROR_ANSWERS = {
  400: 'The request is not valid (bad JSON, a bad path, query or body value, a bad upload); nothing was saved. Code `request/invalid` lists each bad input in `details.issues`.',
  401: 'Not signed in, or the session has ended (`auth/unauthenticated`); at sign-in, a wrong e-mail or password (`auth/invalid_credentials`).',
  403: 'The caller’s role or scope does not allow this (`auth/forbidden`), or the account is deactivated (`auth/deactivated`).',
  404: 'No such row, or none the caller may see (`<resource>/not_found`).',
  409: 'The row changed since the caller read it (`<resource>/version_conflict`: reload and apply the change again), or the row’s state does not allow this.',
  413: 'The body or upload is over its size limit (`request/too_large` or a resource code).',
  415: 'The upload is not of a type this route accepts.',
  429: 'Too many attempts from this address and account (`auth/rate_limited`); wait a few minutes.',
  503: 'An outside service did not answer or answered with something unusable; nothing was saved.',
  500: 'Something failed on the server (`server/internal`); nothing was saved.',
} as const;
export type ErrorStatus = keyof typeof ERROR_ANSWERS;

// Small builders for described answers.
export const str = (description?: string): Schema => ({ type: 'string', ...(description ? { description } : {}) });
export const num = (description?: string): Schema => ({ type: 'number', ...(description ? { description } : {}) });
export const int = (description?: string): Schema => ({ type: 'integer', ...(description ? { description } : {}) });
export const bool = (description?: string): Schema => ({ type: 'boolean', ...(description ? { description } : {}) });
export const date = (description?: string): Schema => ({ type: 'string', format: 'date', ...(description ? { description } : {}) });
export const nullable = (schema: Schema): Schema => ({ ...schema, type: [schema.type as oas31.SchemaObjectType, 'null'] });
/** A row or nested object described in words (its fields are not listed yet). */
export const row = (description: string): Schema => ({ type: 'object', description });
export const rows = (description: string): Schema => ({ type: 'array', description, items: { type: 'object' } });
export const strings = (description: string): Schema => ({ type: 'array', description, items: { type: 'string' } });
export const ref = (name: keyof typeof NAMED): oas31.ReferenceObject => ({ $ref: `#/components/schemas/${name}` });

/** An object answer; every listed key is always present. */
export function shape(properties: Record<string, Schema | oas31.ReferenceObject>, description?: string): Schema {
  return { type: 'object', ...(description ? { description } : {}), properties, required: Object.keys(properties) };
}

/** Named answer parts, listed once under `components.schemas`. */
export const NAMED = {
  SessionUser: shape(
    {
      id: int(),
      email: str(),
      name: str(),
      role: { type: 'string', enum: [...ROLES] },
      districtId: nullable(int('District of a foreman or crew lead')),
      crewId: nullable(int('Crew of a crew lead')),
      siteIds: { type: 'array', items: { type: 'integer' }, description: 'Sites a partner is linked to' },
      units: { type: 'string', enum: [...UNIT_SYSTEMS], description: 'Units the portal shows; the API always speaks SI' },
      version: int('Row version, sent back with a change'),
    },
    'The signed-in user: role and scope decide what every other route allows.',
  ),
  WorkOrderWithMail: {
    type: 'object',
    description: 'The work order as stored (all its columns, SI units), and whether the crew lead was e-mailed about it.',
    properties: { id: int(), version: int(), emailed: int('Crew leads e-mailed about the change (0 when the order has no crew or e-mail is off)') },
    required: ['id', 'version', 'emailed'],
  },
  WeekBoard: shape(
    {
      districtId: int(),
      districtName: str(),
      weekStart: date('The Monday of the week'),
      dates: { type: 'array', items: { type: 'string', format: 'date' }, description: 'The seven dates of the week' },
      yard: row('The district yard where routes start: name, lat, lng'),
      crews: rows('Crews of the district with their hours and working days'),
      orders: rows('Work orders of the week'),
      crewDays: rows('Each crew-day: work, drive and load/unload hours against the crew’s hours, and the route'),
      unassignedHours: num('Planned hours of orders without a crew'),
      warnings: strings('What the planner could not fit or had to assume, in words'),
      lastGeneratedAt: nullable(str('When the week was last generated (ISO 8601), or null')),
    },
    'The week plan board of one district.',
  ),
} satisfies Record<string, Schema>;
