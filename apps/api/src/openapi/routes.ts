/**
 * Every route of the API, for the OpenAPI document: who may call it and the very zod
 * schemas its router parses with (imported, never copied). `tests/api/openapi.test.ts`
 * fails when a route of the Express app is missing here, or listed here but not served.
 */
import type { z } from 'zod';
import type { oas31 } from 'zod-openapi';
import {
  applicationSchema,
  acceptInviteSchema,
  createGameDaySchema,
  gameDayListSchema,
  closeFieldSchema,
  setFieldStripesSchema,
  setFieldLinePlanSchema,
  createLogoSchema,
  logoParamsSchema,
  updateLogoSchema,
  LOGO_MAX_COLOURS,
  closeFieldRequestSchema,
  createFieldRequestSchema,
  declineFieldRequestSchema,
  requestListQuerySchema,
  requestMessageSchema,
  scheduleFieldRequestSchema,
  updateFieldRequestSchema,
  createCrewSchema,
  createEquipmentSchema,
  createFieldEventSchema,
  createFieldSchema,
  createImportSchema,
  createSiteSchema,
  createWorkOrderSchema,
  dateRangeQuerySchema,
  overviewQuerySchema,
  forgotPasswordSchema,
  generateWeekSchema,
  rainOutSchema,
  idParamSchema,
  IMPORT_MAX_BYTES,
  IMPORT_MAX_ROWS,
  inviteUserSchema,
  levelParamSchema,
  listQuerySchema,
  mapQuerySchema,
  needsQuerySchema,
  pageQuerySchema,
  fieldCheckSchema,
  reopenSchema,
  reopenFieldSchema,
  resetPasswordSchema,
  signInSchema,
  updateCrewSchema,
  updateDepartmentSettingsSchema,
  updateCostSettingsSchema,
  budgetQuerySchema,
  budgetLineSchema,
  whatIfSchema,
  whatIfCompareSchema,
  whatIfScenarioListSchema,
  whatIfScenarioSchema,
  compareQuerySchema,
  updateEquipmentSchema,
  updateFieldEventSchema,
  updateFieldSchema,
  updateLevelStandardSchema,
  updateProfileSchema,
  updateSiteSchema,
  updateUserSchema,
  updateWorkOrderSchema,
  calendarTokenParamsSchema,
  createCalendarFeedSchema,
  weatherRangeSchema,
  weekQuerySchema,
  workReportSchema,
  type SubjectName,
} from '@swardwise/domain';
import { districtQuery } from '../routes/crews.ts';
import { auditQuerySchema } from '../routes/directory.ts';
import { listQuery as fieldEventsQuery } from '../routes/field-events.ts';
import { listQuerySchema as importsQuery } from '../routes/imports.ts';
import { csvQuerySchema, MAX_CSV_BYTES } from '../routes/weather.ts';
import { confirmSchema } from '../routes/week-plans.ts';
import { eventParamSchema } from '../routes/game-days.ts';
import { querySchema as workOrdersQuery } from '../routes/work-orders.ts';
import { versionQuerySchema } from '../routes/write-routes.ts';
import { LOGO_MAX_BYTES } from '../services/logo-files.ts';
import { LOGOS_PER_FIELD } from '../services/logos.ts';
import { STATUS_MAX_AGE_S } from '../routes/public.ts';
import { photoBodySchema, photoParamsSchema } from '../routes/photo-routes.ts';
import { checkParamsSchema, checkPhotoParamsSchema } from '../routes/fields.ts';
import { PHOTOS_PER_CHECK } from '../services/field-checks.ts';
import { PHOTO_MAX_BYTES, PHOTO_MEDIA_TYPES, PHOTOS_PER_ORDER } from '../services/work-photos.ts';
import { requestPhotoParamsSchema } from '../routes/requests.ts';
import { setOutQuerySchema } from '../routes/line-plans.ts';
import { PHOTOS_PER_REQUEST } from '../services/requests.ts';
import { allowed, publicAccess, signedIn, type Access } from './access.ts';

/** The list queries default their dates to the department's today; the documented input is the same whatever the day. */
const DOC_TODAY = '2000-01-01';
import { bool, date, int, nullable, num, ref, row, rows, shape, str, strings, type ErrorStatus } from './answers.ts';

export type Method = 'get' | 'post' | 'patch' | 'delete';

/** One success answer. `body` takes a zod schema (rendered as the answer's output) or an OpenAPI schema. */
export interface Answer {
  status: 200 | 201 | 202 | 204;
  description: string;
  body?: z.ZodType | oas31.SchemaObject | oas31.ReferenceObject;
  /** Default `application/json`. */
  contentType?: string;
}

/** A multipart/form-data upload: one file part plus the text fields its schema parses. */
export interface Upload {
  file: string;
  fields?: z.ZodObject;
  /** What the file part may be, for the `encoding` of the part. */
  mediaTypes: string;
  maxBytes: number;
  description: string;
}

export interface RouteDoc {
  method: Method;
  /** The full path as Express mounts it, e.g. `/api/fields/:id`. */
  path: string;
  tag: string;
  summary: string;
  description?: string;
  access: Access;
  params?: z.ZodType<unknown, Record<string, unknown>>;
  query?: z.ZodType<unknown, Record<string, unknown>>;
  body?: z.ZodType;
  upload?: Upload;
  answers: Answer[];
  /** Failures beyond the ones every route of its kind has (400 with input, 401 unless public, 403 with a role check, 404 with an id in the path). */
  errors?: ErrorStatus[];
  /** Served only outside production, by processes with the local mail sink. */
  devOnly?: boolean;
}

const MB = 1024 * 1024;
const json = (status: Answer['status'], description: string, body: Answer['body']): Answer => ({ status, description, body });
const noContent = (description: string): Answer => ({ status: 204, description });
const items = (what: string, extra: Record<string, oas31.SchemaObject> = {}) => shape({ items: rows(what), ...extra });
const VERSION_NOTE = 'Send the `version` you last read; a stale one answers 409 and changes nothing.';

/** The photo part of an upload (re-encoded by the server whatever it was sent as); `fields` when the upload names a `clientRef`. */
const photoUpload = (fields?: z.ZodObject): Upload => ({ file: 'photo', ...(fields ? { fields } : {}), mediaTypes: PHOTO_MEDIA_TYPES, maxBytes: PHOTO_MAX_BYTES, description: `The photo, at most ${PHOTO_MAX_BYTES / MB} MB` });
/** The answers of a photo upload that a retry with the same `clientRef` finds stored. */
const PHOTO_ANSWERS: Answer[] = [
  json(201, 'The photo is stored.', shape({ photo: row('id, width, height, bytes, createdAt and url of the photo'), duplicate: bool('False') })),
  json(200, 'The same photo was already stored (same `clientRef`).', shape({ photo: row('The photo stored first'), duplicate: bool('True') })),
];
/** A stored photo's image, as every photo route serves it. */
const PHOTO_IMAGE: Answer = { status: 200, description: 'The image (JPEG), privately cacheable for a day.', contentType: 'image/jpeg', body: { type: 'string', format: 'binary' } };

/**
 * PATCH `…/:id` of a row people edit with versions, as `writeRoutes` mounts it (and routes
 * alike): the update ability on the row, its id, the body, and 409 for a stale version.
 * `note` follows the version note.
 */
function versionedUpdate(doc: Pick<RouteDoc, 'path' | 'tag' | 'summary'> & { subject: SubjectName; body: z.ZodType; answer: Answer; note?: string }): RouteDoc {
  const description = doc.note ? `${VERSION_NOTE} ${doc.note}` : VERSION_NOTE;
  return { method: 'patch', path: doc.path, tag: doc.tag, summary: doc.summary, description, access: allowed('update', doc.subject), params: idParamSchema, body: doc.body, answers: [doc.answer], errors: [409] };
}

/** DELETE `…/:id?version=` of a row people edit with versions, as `writeRoutes` mounts it: the delete ability on the row, 204 once gone, 409 for a stale version. */
function versionedDelete(doc: Pick<RouteDoc, 'path' | 'tag' | 'summary'> & { subject: SubjectName; deleted: string }): RouteDoc {
  return { method: 'delete', path: doc.path, tag: doc.tag, summary: doc.summary, description: VERSION_NOTE, access: allowed('delete', doc.subject), params: idParamSchema, query: versionQuerySchema, answers: [noContent(doc.deleted)], errors: [409] };
}

const service: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/health',
    tag: 'Service',
    summary: 'Check that the API and its database answer',
    description: 'The database is asked at most once a second; checks in between rely on its last answer.',
    access: publicAccess(),
    answers: [json(200, 'The API and its database answer.', shape({ status: { type: 'string', enum: ['ok'] } }))],
  },
  {
    method: 'get',
    path: '/api/config',
    tag: 'Service',
    summary: 'What the sign-in page needs before anyone signs in: in demo mode, the invented city and its published sign-ins',
    access: publicAccess(),
    answers: [
      json(
        200,
        'The public configuration.',
        shape({
          demo: nullable(row('Null unless the server runs in demo mode: { city, note, signIns: [{ role, label, email, password }] } of the invented demo city')),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/openapi.json',
    tag: 'Service',
    summary: 'This OpenAPI document',
    description: 'Public: it describes routes and shapes, never data. Every other route still checks the caller.',
    access: publicAccess(),
    answers: [json(200, 'The OpenAPI 3.1 document of this API.', row('OpenAPI 3.1 document'))],
  },
];

const auth: RouteDoc[] = [
  {
    method: 'post',
    path: '/api/auth/sign-in',
    tag: 'Auth',
    summary: 'Sign in with e-mail and password',
    description: 'Starts a session: the answer sets the session cookie that every other route reads. Failed attempts are limited per address and account.',
    access: publicAccess(),
    body: signInSchema,
    answers: [json(200, 'Signed in; the session cookie is set.', shape({ user: ref('SessionUser') }))],
    errors: [429],
  },
  {
    method: 'post',
    path: '/api/auth/sign-out',
    tag: 'Auth',
    summary: 'End the session',
    access: publicAccess('Without a session it does nothing and still answers 204.'),
    answers: [noContent('The session is ended and its cookie cleared.')],
  },
  {
    method: 'get',
    path: '/api/auth/me',
    tag: 'Auth',
    summary: 'The signed-in user',
    access: signedIn(),
    answers: [json(200, 'The signed-in user.', shape({ user: ref('SessionUser') }))],
  },
  {
    method: 'patch',
    path: '/api/auth/me',
    tag: 'Auth',
    summary: 'Change one’s own name or units',
    description: VERSION_NOTE,
    access: allowed('update', 'User', { probe: (actor) => ({ id: actor.id, districtId: actor.districtId }) }),
    body: updateProfileSchema,
    answers: [json(200, 'The user after the change.', shape({ user: ref('SessionUser') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/auth/accept-invite',
    tag: 'Auth',
    summary: 'Accept an invitation: set a password and sign in',
    access: publicAccess('The invitation token is the credential.'),
    body: acceptInviteSchema,
    answers: [json(200, 'The account is active and signed in; the session cookie is set.', shape({ user: ref('SessionUser') }))],
    errors: [429],
  },
  {
    method: 'post',
    path: '/api/auth/forgot-password',
    tag: 'Auth',
    summary: 'Ask for a password reset link by e-mail',
    description: 'The same answer whether or not the address has an account.',
    access: publicAccess(),
    body: forgotPasswordSchema,
    answers: [json(202, 'If the address has an account, a reset link is on its way.', shape({ message: str() }))],
    errors: [429],
  },
  {
    method: 'post',
    path: '/api/auth/reset-password',
    tag: 'Auth',
    summary: 'Set a new password with a reset token and sign in',
    access: publicAccess('The reset token is the credential.'),
    body: resetPasswordSchema,
    answers: [json(200, 'The password is changed and the user signed in; other sessions of the account are ended.', shape({ user: ref('SessionUser') }))],
    errors: [429],
  },
];

const users: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/users',
    tag: 'Users',
    summary: 'List user accounts',
    // The service checks reading a user other than oneself in one's own district.
    access: allowed('read', 'User', { probe: (actor) => ({ districtId: actor.districtId ?? -1, id: -1 }) }),
    answers: [json(200, 'Accounts the caller may read, by role and name.', items('Accounts with role, scope, active flag, last sign-in and whether the invitation is still open'))],
  },
  {
    method: 'post',
    path: '/api/users',
    tag: 'Users',
    summary: 'Invite a person (an account with a role and scope)',
    access: allowed('create', 'User'),
    body: inviteUserSchema,
    answers: [
      json(
        201,
        'The account is created, waiting for the person to accept the invitation.',
        shape({ user: row('The new account'), inviteUrl: str('The invitation link, to pass on by hand when e-mail is off'), emailed: bool('True when the invitation was e-mailed'), mail: str("sent, off (no mail set up: pass the link on by hand) or failed") }),
      ),
    ],
    errors: [409],
  },
  {
    method: 'patch',
    path: '/api/users/:id',
    tag: 'Users',
    summary: 'Change a user’s name, role, scope or active flag',
    description: `${VERSION_NOTE} Nobody may deactivate themselves or change their own role.`,
    access: allowed('update', 'User', { note: 'Changing a role or deactivating an account needs the administrator.' }),
    params: idParamSchema,
    body: updateUserSchema,
    answers: [json(200, 'The account after the change.', shape({ user: row('The account') }))],
    errors: [409],
  },
];

const weather: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/weather/stations',
    tag: 'Weather',
    summary: 'Weather stations with the days on file',
    access: allowed('read', 'Weather'),
    answers: [json(200, 'Stations with their counts of days, first and last date and forecast days.', items('Stations', { service: bool('True when a hosted weather service is configured') }))],
  },
  {
    method: 'get',
    path: '/api/weather/stations/:id/days',
    tag: 'Weather',
    summary: 'Daily weather of a station in a date range',
    description: 'SI units: °C, mm, m/s, MJ/m².',
    access: allowed('read', 'Weather'),
    params: idParamSchema,
    query: weatherRangeSchema,
    answers: [json(200, 'The days on file and the dates without weather.', shape({ days: rows('Days on file, oldest first'), gaps: { type: 'array', items: { type: 'string', format: 'date' }, description: 'Dates of the range with no weather' } }))],
  },
  {
    method: 'post',
    path: '/api/weather/stations/:id/csv',
    tag: 'Weather',
    summary: 'Check, and with `commit=true` save, a station file (CSV)',
    description: 'Columns `date,tmax_c,tmin_c` and optionally humidity, wind, sunshine, solar radiation and rain. Without `commit=true` nothing is saved; a file with a bad row is never saved.',
    access: allowed('create', 'Weather'),
    params: idParamSchema,
    query: csvQuerySchema,
    upload: { file: 'file', mediaTypes: 'text/csv', maxBytes: MAX_CSV_BYTES, description: `The station file, a .csv text file of at most ${MAX_CSV_BYTES / MB} MB` },
    answers: [json(200, 'Each row as read with its errors, and a summary.', shape({ committed: bool('True when the days were saved'), rows: rows('Rows of the file with their errors'), summary: shape({ rows: int(), valid: int(), invalid: int() }) }))],
    errors: [413, 415],
  },
  {
    method: 'post',
    path: '/api/weather/stations/:id/pull',
    tag: 'Weather',
    summary: 'Fetch a date range from the hosted weather service and save it',
    access: allowed('create', 'Weather'),
    params: idParamSchema,
    body: weatherRangeSchema,
    answers: [json(200, 'Days saved and dates the service had no weather for.', shape({ saved: int('Days saved'), missing: strings('Dates the service had no weather for') }))],
    errors: [503],
  },
];

const workOrders: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/work-orders',
    tag: 'Work orders',
    summary: 'Work orders in a date range (default: today and the next 6 days)',
    access: allowed('read', 'WorkOrder'),
    query: workOrdersQuery(DOC_TODAY),
    answers: [json(200, 'Work orders the caller may read.', items('Work orders with field, site, crew and equipment names'))],
  },
  {
    method: 'post',
    path: '/api/work-orders',
    tag: 'Work orders',
    summary: 'Add a work order by hand',
    access: allowed('create', 'WorkOrder'),
    body: createWorkOrderSchema,
    answers: [json(201, 'The work order is created; an assigned crew lead is e-mailed.', ref('WorkOrderWithMail'))],
  },
  versionedUpdate({
    path: '/api/work-orders/:id',
    tag: 'Work orders',
    summary: 'Move, assign or re-time a work order',
    subject: 'WorkOrder',
    body: updateWorkOrderSchema,
    answer: json(200, 'The work order after the change; the crew lead is e-mailed when it moved to or from a crew.', ref('WorkOrderWithMail')),
    note: 'Any change pins the order against re-generation of the week.',
  }),
  versionedDelete({
    path: '/api/work-orders/:id',
    tag: 'Work orders',
    summary: 'Delete a work order nobody has logged',
    subject: 'WorkOrder',
    deleted: 'The work order is deleted.',
  }),
  {
    method: 'get',
    path: '/api/work-orders/:id',
    tag: 'Work orders',
    summary: 'One work order as a crew works it: the order, its reports and photos',
    access: allowed('read', 'WorkOrder'),
    params: idParamSchema,
    answers: [json(200, 'The order, its reports (oldest first) and its photos with their URLs.', shape({ order: row('The work order'), updates: rows('Reports on the order'), photos: rows('Photos with id, size and `url`') }))],
  },
  {
    method: 'post',
    path: '/api/work-orders/:id/reports',
    tag: 'Work orders',
    summary: 'Report on a work order: started, done (with hours) or skipped (with a reason)',
    description: 'A report sent again with the same `clientRef` counts once and answers 200 with the first report.',
    access: allowed('log', 'WorkOrder'),
    params: idParamSchema,
    body: workReportSchema,
    answers: [
      json(201, 'The report is saved.', shape({ order: row('The work order after the report'), update: row('The report'), duplicate: bool('False') })),
      json(200, 'The same report was already saved (same `clientRef`); nothing changed.', shape({ order: row('The work order'), update: row('The report saved first'), duplicate: bool('True') })),
    ],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/work-orders/:id/field-check',
    tag: 'Work orders',
    summary: 'Log a field check on a field-check work order: scored, flagged, stored, and the order done',
    description: 'Hardness outside the tester’s range and wet fields carry the usual cautions; local policy decides on closing a field.',
    access: allowed('log', 'WorkOrder'),
    params: idParamSchema,
    body: fieldCheckSchema,
    answers: [json(201, 'The stored check with its score and flags, the advice for each flag and the cautions.', shape({ check: row('The field check'), advice: strings('What each flag means'), cautions: strings('Safety cautions'), coverTargetPct: int('The level’s cover target (%)'), hocMm: num('The field’s HOC (mm)') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/work-orders/:id/application',
    tag: 'Work orders',
    summary: 'Record what was applied on a feed, overseeding, topdressing or weed-control order: product, rate, area, date, applicator (and licence for a pesticide); the day’s station weather is added',
    description: 'The product label is the law; pesticides by a licensed applicator where required. A day still to come, or weed control without a licence number, is refused with 400.',
    access: allowed('log', 'WorkOrder'),
    params: idParamSchema,
    body: applicationSchema,
    answers: [json(201, 'The stored application with the weather on file for its day.', shape({ application: row('The application') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/work-orders/:id/reopen',
    tag: 'Work orders',
    summary: 'Reopen a done or skipped work order',
    description: 'The crew lead may reopen his crew’s job on the department’s day it was reported (a mistaken tap); a foreman or an administrator at any time. The order returns to its open state; the earlier report stays in its reports and the audit log.',
    access: allowed('log', 'WorkOrder'),
    params: idParamSchema,
    body: reopenSchema,
    answers: [json(200, 'The order in its open state and the report that records the reopening.', shape({ order: row('The work order after reopening'), update: row('The reopening report') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/work-orders/:id/photos',
    tag: 'Work orders',
    summary: 'Add a photo to a work order',
    description: `The photo is resized to 1,600 px, stored as JPEG without its metadata; at most ${PHOTOS_PER_ORDER} per order. A photo sent again with the same \`clientRef\` is stored once. The caller is checked before the upload is read.`,
    access: allowed('log', 'WorkOrder'),
    params: idParamSchema,
    upload: photoUpload(photoBodySchema),
    answers: PHOTO_ANSWERS,
    errors: [409, 413, 415],
  },
  {
    method: 'get',
    path: '/api/work-orders/:id/photos/:photoId',
    tag: 'Work orders',
    summary: 'The image of a work order’s photo',
    access: allowed('read', 'WorkOrder'),
    params: photoParamsSchema,
    answers: [PHOTO_IMAGE],
  },
];

const weekPlans: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/week-plans',
    tag: 'Week plan',
    summary: 'The week plan board of a district',
    access: allowed('read', 'WorkOrder', { probe: (actor) => ({ districtId: actor.districtId }), except: ['crew', 'partner'], note: 'The board is for foremen and the department.' }),
    query: weekQuerySchema,
    answers: [json(200, 'The board: crews × days with loads and routes.', ref('WeekBoard'))],
  },
  {
    method: 'post',
    path: '/api/week-plans/generate',
    tag: 'Week plan',
    summary: 'Generate (or with `dryRun`, preview) the week plan of a district',
    description: 'Keeps every order a person touched (moved, assigned, added by hand, started, done, skipped) and plans around it.',
    access: allowed('create', 'WorkOrder', { probe: (actor) => ({ districtId: actor.districtId }) }),
    body: generateWeekSchema,
    answers: [
      json(
        200,
        'What the run adds, changes, removes and keeps, and the board after it (before it, with `dryRun`).',
        shape({ dryRun: bool(), diff: row('Orders to insert, update, remove and keep'), warnings: strings('What could not be planned as the rule asks, in words'), board: ref('WeekBoard') }),
      ),
    ],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/week-plans/confirm',
    tag: 'Week plan',
    summary: 'Assign every suggested crew of the week (optionally of one crew); one e-mail per crew lead',
    access: allowed('update', 'WorkOrder', { probe: (actor) => ({ districtId: actor.districtId }) }),
    body: confirmSchema,
    answers: [json(200, 'How many orders were assigned and crew leads e-mailed, and the board after it.', shape({ assigned: int('Orders assigned'), emailed: int('Crew leads e-mailed'), mail: row('The crew-lead e-mails: crews, sent, mailOff, crewsWithoutLead, failed'), board: ref('WeekBoard') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/week-plans/rain-out',
    tag: 'Week plan',
    summary: "Cancel a day's open work of one crew or of the whole district, with a reason (a rain-out)",
    description: 'Each cancelled order becomes skipped with the reason (the crew sees it on Today); generating the week again puts nothing on that crew-day and asks the cancelled work again on the next working days.',
    access: allowed('update', 'WorkOrder', { probe: (actor) => ({ districtId: actor.districtId }) }),
    body: rainOutSchema,
    answers: [json(200, 'How many orders were cancelled, and the board of the week after it.', shape({ cancelled: int('Orders cancelled'), board: ref('WeekBoard') }))],
  },
  {
    method: 'get',
    path: '/api/records',
    tag: 'Records',
    summary: 'Planned against actual hours and mowings asked against done, by field, crew and week',
    access: allowed('read', 'WorkOrder'),
    query: dateRangeQuerySchema,
    answers: [
      json(
        200,
        'Tallies of the range (hours rounded to 0.01 h).',
        shape({
          from: date(),
          to: date(),
          districtId: nullable(int()),
          asOf: date('The department’s today: later orders are not yet late'),
          byField: rows('Tallies per field'),
          byCrew: rows('Tallies per crew'),
          byWeek: rows('Tallies per week'),
          lateMowings: rows('Mowings done late or missed, latest first'),
          totals: row('Tallies of the whole range'),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/records/applications',
    tag: 'Records',
    summary: 'Applications (feed, seed, topdressing, pesticides) over a range of dates, latest first, with the weather of each day',
    access: allowed('read', 'WorkOrder'),
    query: dateRangeQuerySchema,
    answers: [json(200, 'Applications the caller may read.', shape({ applications: rows('Applications') }))],
  },
];

const sites: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/sites',
    tag: 'Sites',
    summary: 'List sites (parks, schools, complexes)',
    access: allowed('read', 'Site'),
    query: listQuerySchema,
    answers: [json(200, 'Sites the caller may read.', items('Sites'))],
  },
  {
    method: 'post',
    path: '/api/sites',
    tag: 'Sites',
    summary: 'Add a site',
    access: allowed('create', 'Site'),
    body: createSiteSchema,
    answers: [json(201, 'The site as stored.', shape({ site: row('The site') }))],
  },
  {
    method: 'get',
    path: '/api/sites/:id',
    tag: 'Sites',
    summary: 'One site with its fields',
    access: allowed('read', 'Site'),
    params: idParamSchema,
    answers: [json(200, 'The site and its fields.', shape({ site: row('The site'), fields: rows('Fields of the site the caller may read') }))],
  },
  versionedUpdate({
    path: '/api/sites/:id',
    tag: 'Sites',
    summary: 'Change a site',
    subject: 'Site',
    body: updateSiteSchema,
    answer: json(200, 'The site after the change.', shape({ site: row('The site') })),
  }),
];

const fields: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/fields',
    tag: 'Fields',
    summary: 'List fields with their outlines (GeoJSON, WGS84)',
    access: allowed('read', 'Field'),
    query: listQuerySchema,
    answers: [json(200, 'Fields the caller may read.', items('Fields with maintenance level, status and outline (GeoJSON Polygon, [longitude, latitude])'))],
  },
  {
    method: 'post',
    path: '/api/fields',
    tag: 'Fields',
    summary: 'Add a field to a site',
    access: allowed('create', 'Field'),
    body: createFieldSchema,
    answers: [json(201, 'The field as stored.', shape({ field: row('The field') }))],
  },
  {
    method: 'get',
    path: '/api/fields/:id',
    tag: 'Fields',
    summary: 'One field',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    answers: [json(200, 'The field.', shape({ field: row('The field') }))],
  },
  {
    method: 'get',
    path: '/api/fields/:id/checks',
    tag: 'Fields',
    summary: 'A field’s latest field checks with their scores and flags, newest first',
    access: allowed('read', 'FieldCheck'),
    params: idParamSchema,
    answers: [json(200, 'Up to 20 checks, each with its photos, and the level’s target score.', shape({ items: rows('Field checks'), targetScore: num('The surface score the field’s level targets') }))],
  },
  {
    method: 'post',
    path: '/api/fields/:id/checks',
    tag: 'Fields',
    summary: 'Log a field check from the field page, without a work order: scored, flagged, stored',
    description: 'For staff who may create field checks in the field’s district (its foreman, an administrator). The caller is checked before the body is read.',
    access: allowed('create', 'FieldCheck'),
    params: idParamSchema,
    body: fieldCheckSchema,
    answers: [json(201, 'The stored check with its score and flags, the advice for each flag and the cautions.', shape({ check: row('The field check'), advice: strings('What each flag means'), cautions: strings('Safety cautions'), coverTargetPct: int('The level’s cover target (%)'), hocMm: num('The field’s HOC (mm)') }))],
  },
  {
    method: 'post',
    path: '/api/fields/:id/checks/:checkId/photos',
    tag: 'Fields',
    summary: 'Add a photo to a field check logged from the field page',
    description: `Stored as the crews’ photos are (1,600 px JPEG without metadata); at most ${PHOTOS_PER_CHECK} per check. A check logged on a work order keeps its photos with the order (409). The caller is checked before the upload is read.`,
    access: allowed('create', 'FieldCheck'),
    params: checkParamsSchema,
    upload: photoUpload(photoBodySchema),
    answers: PHOTO_ANSWERS,
    errors: [409, 413, 415],
  },
  {
    method: 'get',
    path: '/api/fields/:id/checks/:checkId/photos/:photoId',
    tag: 'Fields',
    summary: 'The image of a field check’s photo',
    access: allowed('read', 'FieldCheck'),
    params: checkPhotoParamsSchema,
    answers: [PHOTO_IMAGE],
  },
  {
    method: 'get',
    path: '/api/fields/:id/growth-calibration',
    tag: 'Fields',
    summary: 'The field’s growth against the engine’s prediction: calibration factor, calibrated rate and confidence',
    description: 'Each check with a measured height and the days since the last cut gives an observed growth (height − HOC), compared with the engine’s predicted growth for those days. Shown on the field page; the mowing prediction keeps the default rate.',
    access: allowed('read', 'FieldCheck'),
    params: idParamSchema,
    answers: [json(200, 'The calibration.', shape({ calibration: row('factor, n, spread, confidence, defaultRateMmPerDay, calibratedRateMmPerDay, hocMm, readings, skipped, usedForMowing, stationName') }))],
  },
  {
    method: 'get',
    path: '/api/fields/:id/work',
    tag: 'Fields',
    summary: 'A field’s work history: logged jobs with the crews’ notes and photos, newest first',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    query: pageQuerySchema,
    answers: [json(200, 'One page of the field’s logged work orders, each with its reports and photos.', shape({ items: rows('Jobs: order, updates, photos'), page: int('Page number'), pageSize: int('Jobs per page'), total: int('Logged jobs in all') }))],
  },
  {
    method: 'get',
    path: '/api/fields/:id/needs',
    tag: 'Fields',
    summary: 'What a field needs on a date: growth potential, mowings, feed, water and lines',
    description: 'Supports decisions; product labels, local codes and licensed practice decide.',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    query: needsQuerySchema,
    answers: [json(200, 'The field’s needs from its level, grass and the weather of the nearest station (SI units).', shape({ needs: row('Needs of the field') }))],
  },
  versionedUpdate({
    path: '/api/fields/:id',
    tag: 'Fields',
    summary: 'Change a field (level, status, outline, …)',
    subject: 'Field',
    body: updateFieldSchema,
    answer: json(200, 'The field after the change.', shape({ field: row('The field') })),
  }),
  versionedDelete({
    path: '/api/fields/:id',
    tag: 'Fields',
    summary: 'Delete a field',
    subject: 'Field',
    deleted: 'The field is deleted.',
  }),
];

const fieldEvents: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/field-events',
    tag: 'Field events',
    summary: 'Bookings of fields (games, tournaments, …) in a date range (default: the next 92 days)',
    access: allowed('read', 'FieldEvent'),
    query: fieldEventsQuery(DOC_TODAY),
    answers: [json(200, 'Bookings the caller may read.', items('Bookings'))],
  },
  {
    method: 'post',
    path: '/api/field-events',
    tag: 'Field events',
    summary: 'Book a field',
    access: allowed('create', 'FieldEvent'),
    body: createFieldEventSchema,
    answers: [json(201, 'The booking as stored.', shape({ event: row('The booking') }))],
  },
  versionedUpdate({
    path: '/api/field-events/:id',
    tag: 'Field events',
    summary: 'Change a booking',
    subject: 'FieldEvent',
    body: updateFieldEventSchema,
    answer: json(200, 'The booking after the change.', shape({ event: row('The booking') })),
  }),
  versionedDelete({
    path: '/api/field-events/:id',
    tag: 'Field events',
    summary: 'Cancel a booking',
    subject: 'FieldEvent',
    deleted: 'The booking is deleted.',
  }),
];

const standards: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/standards',
    tag: 'Standards',
    summary: 'The Standards: each maintenance level, and the department’s parameters',
    access: allowed('read', 'Standards'),
    answers: [json(200, 'The four levels and the department parameters.', shape({ levels: rows('Maintenance levels 1–4 with HOC, mowing, feed, water and line settings'), parameters: row('Department parameters') }))],
  },
  {
    method: 'patch',
    path: '/api/standards/:level',
    tag: 'Standards',
    summary: 'Change one maintenance level',
    description: VERSION_NOTE,
    access: allowed('update', 'Standards'),
    params: levelParamSchema,
    body: updateLevelStandardSchema,
    answers: [json(200, 'The level after the change.', shape({ standard: row('The level') }))],
    errors: [409],
  },
];

const settings: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/settings',
    tag: 'Settings',
    summary: 'The department settings: its time zone (IANA name), where it comes from and its version',
    access: allowed('manage', 'Settings'),
    answers: [json(200, 'The settings.', shape({ timeZone: str('IANA time-zone name'), source: str('setting or default'), defaultTimeZone: str(), version: int() }))],
  },
  {
    method: 'patch',
    path: '/api/settings',
    tag: 'Settings',
    summary: 'Change the department time zone; "today" and week boundaries follow at once',
    description: VERSION_NOTE,
    access: allowed('manage', 'Settings'),
    body: updateDepartmentSettingsSchema,
    answers: [json(200, 'The settings after the change.', shape({ timeZone: str('IANA time-zone name'), source: str('setting or default'), defaultTimeZone: str(), version: int() }))],
    errors: [409],
  },
];

const costsAnswer = shape({
  costs: row('Every cost and rate, per SI unit: currency, labourRatePerHour, crewRates [{crewId, ratePerHour}], fuelPricePerL, fuelLPerHour by machine kind, waterPricePerM3, fertiliserPricePerKgN, seedPricePerKg, paintPricePerL, colourantPricePerL'),
  source: str('setting once entered, default while the starting values apply'),
  version: int(),
});
const compareAnswer = shape({
  period: row('The days compared: { kind: season | last12 | range, from, to } (department-local dates)'),
  currency: str('The currency of every amount'),
  districtId: int(),
  rows: rows('One site: siteId, siteName, districtId, districtName, level (by most field area), fieldCount, areaM2, acres, ordersDone, hours, fertiliserKgN, waterM3, paintL, seedKg, colourantL, cost { labour, fuel, fertiliser, water, paint, seed, colourant, inputs, total }, costPerAcre, hoursPerAcre, inputsPerAcre (per international acre), surfaceScore (0–100), fieldsChecked'),
  totals: row('Sums over the rows, per-acre figures over the summed acres'),
});
const compare: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/compare/sites',
    tag: 'Settings',
    summary: 'Sites compared over a period: cost, hours and inputs per acre, and surface score',
    description: 'The head sees every district (or the one asked); a foreman his own (another district is a 403). Work counts on its planned day; hours are the actual ones, else the planned.',
    access: allowed('read', 'SiteComparison'),
    query: compareQuerySchema,
    answers: [json(200, 'The sites and their totals.', compareAnswer)],
  },
  {
    method: 'get',
    path: '/api/compare/sites.csv',
    tag: 'Settings',
    summary: 'The same comparison as a CSV file, one line per site',
    access: allowed('read', 'SiteComparison'),
    query: compareQuerySchema,
    answers: [{ status: 200, description: 'The CSV (UTF-8, header line first).', contentType: 'text/csv', body: { type: 'string' } }],
  },
];
const costs: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/costs',
    tag: 'Settings',
    summary: 'The department’s costs and rates: labour per crew hour, fuel, water and product prices',
    access: allowed('read', 'CostSettings'),
    answers: [json(200, 'The costs and rates.', costsAnswer)],
  },
  {
    method: 'patch',
    path: '/api/costs',
    tag: 'Settings',
    summary: 'Set every cost and rate at once; audited',
    description: `${VERSION_NOTE} Crew rates must name crews that exist.`,
    access: allowed('update', 'CostSettings'),
    body: updateCostSettingsSchema,
    answers: [json(200, 'The costs after the change.', costsAnswer)],
    errors: [409],
  },
];

const budgetAnswer = shape({
  season: int('calendar year'),
  districtId: nullable(int('null: the department')),
  scopeName: str(),
  currency: str('ISO 4217 code'),
  outlook: row('{ from, to, fields, note }: the weather days and fields the turf engine’s outlook covers'),
  actualTo: date('done work counted up to this department date'),
  lines: rows('Per line (labour, fuel, fertiliser, water, paint, seed, equipment): label, quantityUnit, money, budget, version, outlook { quantity, cost }, actual { quantity, cost }'),
  totals: row('{ budget, outlook, actual } of the money lines'),
});
const budgetScopeNote = 'A foreman reads his own district (the default when none is named); another district or the department answers 403.';
const budget: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/budget',
    tag: 'Budget',
    summary: 'The season budget per line against the turf engine’s outlook and the actual to date from the work records',
    description: budgetScopeNote,
    access: allowed('read', 'Budget'),
    query: budgetQuerySchema,
    answers: [json(200, 'The budget lines.', budgetAnswer)],
  },
  {
    method: 'get',
    path: '/api/budget/export.csv',
    tag: 'Budget',
    summary: 'The season budget as CSV (one row per line, the same rounded figures as the JSON answer)',
    description: budgetScopeNote,
    access: allowed('read', 'Budget'),
    query: budgetQuerySchema,
    answers: [{ status: 200, description: 'The budget as CSV.', contentType: 'text/csv', body: { type: 'string' } }],
  },
  {
    method: 'get',
    path: '/api/budget/report.pdf',
    tag: 'Budget',
    summary: 'The season budget as a printable PDF with its chart (budget, outlook and actual per line)',
    description: budgetScopeNote,
    access: allowed('read', 'Budget'),
    query: budgetQuerySchema,
    answers: [{ status: 200, description: 'The report (PDF).', contentType: 'application/pdf', body: { type: 'string', format: 'binary' } }],
  },
  {
    method: 'patch',
    path: '/api/budget/line',
    tag: 'Budget',
    summary: 'Set (or clear, amount null) one line of a season’s budget for a district or the department; audited',
    description: 'Send the line’s `version` you last read, none for a line never set; a stale one answers 409 and changes nothing.',
    access: allowed('update', 'Budget'),
    body: budgetLineSchema,
    answers: [json(200, 'The line after the change.', shape({ line: row('{ line, budget, version }') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/what-if',
    tag: 'Budget',
    summary: 'Preview a scenario (fields moved to other levels, levels’ Standards changed): the season before, after and the change in mowings, hours, inputs and cost; nothing is saved',
    description: `${budgetScopeNote} A moved field of another district answers 403.`,
    access: allowed('read', 'Budget'),
    body: whatIfSchema,
    answers: [json(200, 'The season before and after, and the change.', shape({ season: int(), districtId: nullable(int()), scopeName: str(), currency: str(), result: row('{ before, after, delta } each { totals, lines }; byDistrict; fieldsTouched') }))],
  },
  {
    method: 'get',
    path: '/api/what-if/scenarios',
    tag: 'Budget',
    summary: 'The saved what-ifs the caller may read (a foreman: his district’s), newest first',
    access: allowed('read', 'WhatIfScenario'),
    query: whatIfScenarioListSchema,
    answers: [json(200, 'The saved scenarios.', items('[{ id, name, season, districtId, scopeName, change, createdBy, createdByName, createdAt, mine }]'))],
  },
  {
    method: 'post',
    path: '/api/what-if/scenarios',
    tag: 'Budget',
    summary: 'Save a what-if under a name: the change (fields moved, Standards changed), not its result',
    description: 'A foreman saves only in his own district; a moved field outside the scenario’s district answers 403.',
    access: allowed('create', 'WhatIfScenario'),
    body: whatIfScenarioSchema,
    answers: [json(201, 'The saved scenario.', shape({ scenario: row('{ id, name, season, districtId, scopeName, change, createdBy, createdByName, createdAt, mine }') }))],
  },
  {
    method: 'get',
    path: '/api/what-if/scenarios/compare',
    tag: 'Budget',
    summary: 'Two to four saved what-ifs side by side, each worked out again against today’s outlook',
    description: 'A scenario the caller may not read answers 404, as one that does not exist.',
    access: allowed('read', 'WhatIfScenario'),
    query: whatIfCompareSchema,
    answers: [json(200, 'Each scenario with its change.', items('[{ scenario, answer: { season, districtId, scopeName, currency, result } }]'))],
  },
  {
    method: 'delete',
    path: '/api/what-if/scenarios/:id',
    tag: 'Budget',
    summary: 'Remove a saved what-if (only the one who saved it)',
    access: allowed('delete', 'WhatIfScenario'),
    params: idParamSchema,
    answers: [noContent('The scenario is removed.')],
  },
];

const importNote = 'Only the person who uploaded an import may commit or undo it.';
const imports: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/imports',
    tag: 'Imports',
    summary: 'Recent imports',
    access: allowed('create', 'Import'),
    query: importsQuery,
    answers: [json(200, 'Imports the caller may read, newest first.', items('Imports', { lastCommittedId: nullable(int('The caller’s last committed import, the one that may be undone')) }))],
  },
  {
    method: 'post',
    path: '/api/imports',
    tag: 'Imports',
    summary: 'Upload sites or fields (CSV) or field outlines (GeoJSON) for a preview',
    description: `Nothing is saved but the preview; at most ${IMPORT_MAX_ROWS} rows. The caller is checked before the upload is read.`,
    access: allowed('create', 'Import'),
    upload: { file: 'file', fields: createImportSchema, mediaTypes: 'text/csv, application/geo+json, application/json', maxBytes: IMPORT_MAX_BYTES, description: `The file, at most ${IMPORT_MAX_BYTES / MB} MB` },
    answers: [json(201, 'The preview: each row with what importing would do and its errors.', shape({ import: row('The import with its rows and summary') }))],
    errors: [413, 415],
  },
  {
    method: 'get',
    path: '/api/imports/:id',
    tag: 'Imports',
    summary: 'One import with its rows',
    access: allowed('create', 'Import'),
    params: idParamSchema,
    answers: [json(200, 'The import.', shape({ import: row('The import with its rows and summary') }))],
  },
  {
    method: 'post',
    path: '/api/imports/:id/commit',
    tag: 'Imports',
    summary: 'Import a preview without errors',
    access: allowed('create', 'Import', { note: importNote }),
    params: idParamSchema,
    answers: [json(200, 'The rows are saved.', shape({ import: row('The committed import') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/imports/:id/undo',
    tag: 'Imports',
    summary: 'Undo one’s last import, if nobody changed its rows since',
    access: allowed('create', 'Import', { note: importNote }),
    params: idParamSchema,
    answers: [json(200, 'The rows are back as they were.', shape({ import: row('The undone import') }))],
    errors: [409],
  },
];

const map: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/map',
    tag: 'Map',
    summary: 'Districts, sites and fields with their state on a day (GeoJSON geometry, WGS84)',
    access: allowed('read', 'Field'),
    query: mapQuerySchema,
    answers: [
      json(
        200,
        'What the status board map shows.',
        shape({
          asOf: date('The day the values describe: today, or the latest day with weather when today has none'),
          requested: date('The day asked for'),
          weatherNote: nullable(str('Plain words when `asOf` is not the day asked for, or weather is missing')),
          districts: rows('Districts with their boundary (GeoJSON Polygon)'),
          sites: rows('Sites with their position'),
          fields: rows('Fields with outline, status, predicted height, overdue mowing and surface score'),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/map/basemap',
    tag: 'Map',
    summary: 'The basemap: a bundled vector map or the configured tile server',
    access: allowed('read', 'Field'),
    answers: [json(200, 'The basemap to draw under the fields.', shape({ basemap: { description: 'GeoJSON FeatureCollection of the bundled basemap, or null' }, tileUrl: nullable(str('Tile URL template')), attribution: nullable(str()) }))],
  },
];

const directory: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/districts',
    tag: 'Directory',
    summary: 'Districts',
    access: allowed('read', 'District'),
    answers: [json(200, 'Districts the caller may read.', items('Districts with their yard'))],
  },
  {
    method: 'get',
    path: '/api/audit',
    tag: 'Directory',
    summary: 'The audit log: who changed what, with the row before and after',
    access: allowed('read', 'AuditEntry'),
    query: auditQuerySchema,
    answers: [json(200, 'Entries the caller may read, newest first.', items('Audit entries'))],
  },
];

const crews: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/crews',
    tag: 'Crews',
    summary: 'Crews',
    access: allowed('read', 'Crew'),
    query: districtQuery,
    answers: [json(200, 'Crews the caller may read.', items('Crews with hours per day, members and working days'))],
  },
  {
    method: 'post',
    path: '/api/crews',
    tag: 'Crews',
    summary: 'Add a crew',
    access: allowed('create', 'Crew'),
    body: createCrewSchema,
    answers: [json(201, 'The crew as stored.', shape({ crew: row('The crew') }))],
  },
  versionedUpdate({
    path: '/api/crews/:id',
    tag: 'Crews',
    summary: 'Change a crew',
    subject: 'Crew',
    body: updateCrewSchema,
    answer: json(200, 'The crew after the change.', shape({ crew: row('The crew') })),
  }),
  versionedDelete({
    path: '/api/crews/:id',
    tag: 'Crews',
    summary: 'Delete a crew without a crew lead',
    subject: 'Crew',
    deleted: 'The crew is deleted.',
  }),
  {
    method: 'get',
    path: '/api/equipment',
    tag: 'Equipment',
    summary: 'Mowers, line markers, spreaders and other equipment',
    access: allowed('read', 'Equipment'),
    query: districtQuery,
    answers: [json(200, 'Equipment the caller may read.', items('Equipment with kind, widths (m), speeds (km/h), HOC range (mm) and hour meter (h)'))],
  },
  {
    method: 'post',
    path: '/api/equipment',
    tag: 'Equipment',
    summary: 'Add equipment',
    access: allowed('create', 'Equipment'),
    body: createEquipmentSchema,
    answers: [json(201, 'The equipment as stored.', shape({ equipment: row('The equipment') }))],
  },
  versionedUpdate({
    path: '/api/equipment/:id',
    tag: 'Equipment',
    summary: 'Change equipment',
    subject: 'Equipment',
    body: updateEquipmentSchema,
    answer: json(200, 'The equipment after the change.', shape({ equipment: row('The equipment') })),
  }),
  versionedDelete({
    path: '/api/equipment/:id',
    tag: 'Equipment',
    summary: 'Delete equipment',
    subject: 'Equipment',
    deleted: 'The equipment is deleted.',
  }),
];

const mailRow = row('One message: id, to, subject, state (queued, sent, failed), attempts, lastError, nextAttemptAt, sentAt, createdAt — never its text, which may hold sign-in links');
const mailOutbox: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/mail-outbox',
    tag: 'Settings',
    summary: 'The e-mail outbox: queued, sent and given-up messages, newest first',
    description: 'Recipient, subject and delivery state of each message; never its text (invitation and reset links).',
    access: allowed('read', 'MailOutbox'),
    answers: [
      json(200, 'The newest messages and the count per state.', shape({ items: rows('The newest messages, at most `limit`; each as mailRow'), counts: row('queued, sent, failed: messages per state'), limit: int(), smtpConfigured: bool('false: no SMTP server configured, messages are logged rather than queued') })),
    ],
  },
  {
    method: 'post',
    path: '/api/mail-outbox/:id/retry',
    tag: 'Settings',
    summary: 'Send a given-up message again now, with a fresh round of attempts; audited',
    access: allowed('update', 'MailOutbox'),
    params: idParamSchema,
    answers: [json(200, 'The message queued again.', shape({ mail: mailRow }))],
    errors: [404, 409],
  },
];

const dev: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/dev/mail',
    tag: 'Development',
    summary: 'Messages caught by the local mail sink',
    description: 'Only in development and tests; production never serves it.',
    access: allowed('manage', 'Settings'),
    devOnly: true,
    answers: [json(200, 'The sink’s port and its messages, newest last.', shape({ port: nullable(int()), items: rows('Messages') }))],
  },
  {
    method: 'delete',
    path: '/api/dev/mail',
    tag: 'Development',
    summary: 'Empty the local mail sink',
    description: 'Only in development and tests; production never serves it.',
    access: allowed('manage', 'Settings'),
    devOnly: true,
    answers: [noContent('The sink is empty.')],
  },
];

const closures: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/public/status',
    tag: 'Closures',
    summary: 'The public status board: every kept field by district and site, with its status, the reason in plain words and the last change',
    description: `No sign-in. Says nothing else: no ids, no people, no internal notes. Cacheable for ${STATUS_MAX_AGE_S} s with an ETag; a request with a matching If-None-Match answers 304 with no body.`,
    access: publicAccess(),
    answers: [
      json(
        200,
        'The board.',
        shape({
          at: str('When the answer was built (ISO instant)'),
          counts: row('Fields by status: { open, restricted, closed }'),
          districts: rows('[{ name, sites: [{ name, address, fields: [{ name, sport, status, reason, since, expectedReopenOn }] }] }]'),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/fields/:id/closures',
    tag: 'Closures',
    summary: 'A field’s closures: the decision in force, its history, the planned work closing would touch, and what the latest field check suggests',
    access: allowed('read', 'FieldClosure'),
    params: idParamSchema,
    answers: [json(200, 'The field’s closures.', shape({ closures: row('{ fieldId, status, version, current, history, plannedWork, suggestion }') }))],
  },
  {
    method: 'post',
    path: '/api/fields/:id/closures',
    tag: 'Closures',
    summary: 'Close or restrict a field (or change the closure in force), deciding what becomes of its planned work',
    description: `${VERSION_NOTE} The version is the field’s. With planned or assigned work before the expected reopening, \`work\` is required: keep it, move it to the next open working day of its crew (needs \`expectedReopenOn\`), or cancel it with the closure’s reason; done in the same transaction. The site’s partners are e-mailed. Lightning, hardness and wet-field cautions apply; local rules and the governing body decide.`,
    access: allowed('create', 'FieldClosure'),
    params: idParamSchema,
    body: closeFieldSchema,
    answers: [json(201, 'The closure and what happened to the work.', shape({ closure: row('The closure in force'), fieldVersion: int('The field’s version after the change'), work: row('{ kept, moved: [{ id, from, to }], cancelled }') }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/fields/:id/reopen',
    tag: 'Closures',
    summary: 'Reopen a closed or restricted field',
    description: `${VERSION_NOTE} The version is the field’s. The site’s partners are e-mailed.`,
    access: allowed('create', 'FieldClosure'),
    params: idParamSchema,
    body: reopenFieldSchema,
    answers: [json(201, 'The reopening.', shape({ closure: row('The reopening, now in force'), fieldVersion: int('The field’s version after the change'), work: row('Empty lists') }))],
    errors: [409],
  },
];

const stripes: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/fields/:id/stripes',
    tag: 'Fields',
    summary: 'A field’s stripe pattern and the district’s mowers its pass plan may be worked out for',
    description: 'The pass plan itself (passes, distance, time) is the engine’s `fieldStripePlan` over the field’s outline with the chosen mower’s figures.',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    answers: [json(200, 'The pattern.', shape({ stripes: row('{ fieldId, pattern, mowerId, version, updatedAt, setByName, mowers, defaultMower }') }))],
  },
  {
    method: 'patch',
    path: '/api/fields/:id/stripes',
    tag: 'Fields',
    summary: 'Set or clear (pattern null) a field’s stripe pattern and the mower it is planned for',
    description: 'The version is the stripe row’s (null while the field has none); a stale one is a 409. The mower must be an active mower of the field’s district. The week plan puts the pattern on the field’s mowing orders.',
    access: allowed('update', 'Field'),
    params: idParamSchema,
    body: setFieldStripesSchema,
    answers: [json(200, 'The pattern as saved.', shape({ stripes: row('As GET') }))],
    errors: [409],
  },
];

const LOGO_ROW = 'The logo: { id, fieldId, name, mime, pixelWidth, pixelHeight, centerXM, centerYM, widthM, heightM, rotationDeg, gridSpacingM, colours, backgroundHex, grid, paint, insideField, imageUrl, pdfUrl, version, createdAt, updatedAt }';

const logos: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/fields/:id/logos',
    tag: 'Fields',
    summary: 'A field’s logos with their grid set-out and paint per colour',
    description: 'Coordinates are metres in the field’s frame (x along the long axis from an end line, y across from a side line). Paint is the department’s first coat, with a white base coat under every colour that is not white.',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    answers: [json(200, 'The field’s frame, its logos and the dark-pigment caution.', shape({ logos: row('{ fieldId, fieldName, lengthM, widthM, logos, caution }') }))],
  },
  {
    method: 'post',
    path: '/api/fields/:id/logos',
    tag: 'Fields',
    summary: 'Upload a logo (SVG or PNG) onto a field, placed at its centre',
    description: `An SVG is cleaned (no scripts, event handlers, foreignObject, styles or links outside the file; a DOCTYPE or entities refuse it) and rendered to PNG; a PNG is re-encoded without metadata. The picture is reduced to at most ${LOGO_MAX_COLOURS} paint colours. At most ${LOGOS_PER_FIELD} logos per field. The caller is checked before the upload is read.`,
    access: allowed('update', 'Field'),
    params: idParamSchema,
    upload: { file: 'logo', fields: createLogoSchema, mediaTypes: 'image/svg+xml, image/png', maxBytes: LOGO_MAX_BYTES, description: `The logo, at most ${LOGO_MAX_BYTES / MB} MB` },
    answers: [json(201, 'The logo is stored.', shape({ logo: row(LOGO_ROW) }))],
    errors: [409, 413, 415],
  },
  {
    method: 'patch',
    path: '/api/fields/:id/logos/:logoId',
    tag: 'Fields',
    summary: 'Move, scale, turn or rename a logo, or change its grid spacing',
    access: allowed('update', 'Field'),
    params: logoParamsSchema,
    body: updateLogoSchema,
    answers: [json(200, 'The logo as saved.', shape({ logo: row(LOGO_ROW) }))],
    errors: [409],
  },
  {
    method: 'delete',
    path: '/api/fields/:id/logos/:logoId',
    tag: 'Fields',
    summary: 'Remove a logo and its files',
    access: allowed('update', 'Field'),
    params: logoParamsSchema,
    query: versionQuerySchema,
    answers: [noContent('The logo is removed.')],
    errors: [409],
  },
  {
    method: 'get',
    path: '/api/fields/:id/logos/:logoId/image',
    tag: 'Fields',
    summary: 'The logo drawn as a PNG (the cleaned upload, rendered)',
    access: allowed('read', 'Field'),
    params: logoParamsSchema,
    answers: [{ status: 200, description: 'The image (PNG), privately cacheable for a day.', contentType: 'image/png', body: { type: 'string', format: 'binary' } }],
  },
  {
    method: 'get',
    path: '/api/fields/:id/logos/:logoId/grid.pdf',
    tag: 'Fields',
    summary: 'The logo’s set-out sheet: the grid with its coordinates, the logo over it, the reference corner, paint per colour and the caution',
    access: allowed('read', 'Field'),
    params: logoParamsSchema,
    answers: [{ status: 200, description: 'The sheet (PDF, A4 landscape).', contentType: 'application/pdf', body: { type: 'string', format: 'binary' } }],
  },
];

const linePlans: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/fields/:id/lines',
    tag: 'Fields',
    summary: 'A field’s line plan: its layouts, paint choices, season window and seasonal shifts, with what its figures need',
    description: 'The figures (segments on the field’s frame, totals, set-out points, repaint schedule) are the engine’s `linePlanFigures` over the field’s outline.',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    answers: [json(200, 'The plan (no layouts while the field has none).', shape({ linePlan: row('{ fieldId, layouts, paint, markerId, seasonStart, seasonEnd, shifts, version, updatedAt, setByName, settings, markers, repaintDays, events, today }') }))],
  },
  {
    method: 'patch',
    path: '/api/fields/:id/lines',
    tag: 'Fields',
    summary: 'Save a field’s line plan',
    description: `Each layout’s size must lie in its governing body’s range (the message gives the range). The marker must be an active line marker of the field’s district. The version is the plan row’s (null while the field has none). ${VERSION_NOTE}`,
    access: allowed('update', 'Field'),
    params: idParamSchema,
    body: setFieldLinePlanSchema,
    answers: [json(200, 'The plan as saved.', shape({ linePlan: row('As GET') }))],
    errors: [409],
  },
  {
    method: 'get',
    path: '/api/fields/:id/lines/set-out.pdf',
    tag: 'Fields',
    summary: 'The string-line set-out sheet of a field’s line plan for a season, as a PDF',
    description: 'The plan drawn to scale on the field’s outline, then per layout its points as distances from the reference corner and as coordinates, and the tape checks (diagonals, 3-4-5).',
    access: allowed('read', 'Field'),
    params: idParamSchema,
    query: setOutQuerySchema,
    answers: [{ status: 200, description: 'The set-out sheet.', contentType: 'application/pdf', body: { type: 'string', format: 'binary' } }],
  },
];

const gameDays: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/game-days',
    tag: 'Game days',
    summary: 'Game-day preparations of events in a date range (default: from today, 60 days), with each step’s work order and the progress',
    description: 'A partner reads only those of their sites, without work order ids, crews or hours.',
    access: allowed('read', 'GameDayPrep'),
    query: gameDayListSchema,
    answers: [json(200, 'Preparations the caller may read.', items('Game-day preparations'))],
  },
  {
    method: 'get',
    path: '/api/game-days/:id',
    tag: 'Game days',
    summary: 'One game-day preparation',
    access: allowed('read', 'GameDayPrep'),
    params: idParamSchema,
    answers: [json(200, 'The preparation.', shape({ gameDay: row('As an item of GET /api/game-days') }))],
  },
  {
    method: 'get',
    path: '/api/game-days/:id/checklist.pdf',
    tag: 'Game days',
    summary: 'The game-day checklist as a printable PDF: event, field, date, steps with day, crew and hours, tick boxes',
    access: allowed('read', 'GameDayPrep'),
    params: idParamSchema,
    answers: [{ status: 200, description: 'The checklist (PDF, one page).', contentType: 'application/pdf', body: { type: 'string', format: 'binary' } }],
  },
  {
    method: 'post',
    path: '/api/game-days/events/:eventId',
    tag: 'Game days',
    summary: 'Prepare an event: a checklist of the chosen steps, each a pinned work order on the last working days before it within the crews’ hours',
    description: 'Work already planned for the event (the week plan’s painting for it, a cut or a check in the days before) joins the checklist instead of being doubled. Re-generating a week keeps the orders. 409 when the event has one already.',
    access: allowed('create', 'GameDayPrep'),
    params: eventParamSchema,
    body: createGameDaySchema,
    answers: [json(201, 'The preparation, and how many crew leads were e-mailed of their new jobs.', shape({ gameDay: row('As an item of GET /api/game-days'), emailed: int('Crew leads e-mailed') }))],
    errors: [409],
  },
];

const partner: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/partner/fields',
    tag: 'Partner',
    summary: 'The partner’s fields in plain words, by site: status and expected reopening, latest surface score, next mowing and line painting, coming bookings',
    description: 'Only the fields of the caller’s linked sites. No costs, no internal notes, no staff names.',
    access: allowed('read', 'PartnerView'),
    answers: [
      json(
        200,
        'The partner’s fields.',
        shape({
          today: date('The department’s local date'),
          sites: rows('[{ name, address, fields: [{ id, name, sport, status: { status, headline, reason, since, expectedReopenOn }, score, checkedOn, nextMowing: { on, basis }, nextLines: { on, basis }, comingBookings }] }]'),
          cautions: strings('Wet fields, lightning, what the surface score is for'),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/partner/fields/:id',
    tag: 'Partner',
    summary: 'One of the partner’s fields: status, latest field check with photos and its meaning, next mowing and line painting, one list of bookings',
    description: 'A field of another site answers 404, as if it did not exist.',
    access: allowed('read', 'PartnerView'),
    params: idParamSchema,
    answers: [
      json(
        200,
        'The field.',
        shape({
          today: date('The department’s local date'),
          field: row('{ id, name, sport, siteName, siteAddress }'),
          status: row('{ status, headline, reason, since, expectedReopenOn }'),
          check: nullable(row('{ checkedOn, score, targetScore, meaning, photos: [{ url, width, height }] }')),
          nextMowing: row('{ on, basis }'),
          nextLines: row('{ on, basis }'),
          agenda: rows('[{ type: "booking", id, kind, title, startsOn, startTime, notes, mine, version }]'),
          canBook: bool('The caller may book this field'),
          cautions: strings('Wet fields, lightning, what the surface score is for'),
        }),
      ),
    ],
  },
  {
    method: 'get',
    path: '/api/partner/fields/:id/photos/:photoId',
    tag: 'Partner',
    summary: 'A photo of the latest field check of one of the partner’s fields',
    access: allowed('read', 'PartnerView'),
    params: photoParamsSchema,
    answers: [PHOTO_IMAGE],
  },
];

const REQUEST_ROW = 'The request: { id, fieldId, fieldName, siteId, siteName, districtId, kind, gameOn, startTime, layout, description, state, reason, eventId, workOrderId, createdBy, createdByName, photoCount, messageCount, version, createdAt, updatedAt }';
const REQUEST_DETAIL = shape({ request: row(REQUEST_ROW), messages: rows('The thread, oldest first'), photos: rows('Photos with id, size and `url`'), work: rows('Work the request became: { id, task, plannedDate, status }') });

const requests: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/requests',
    tag: 'Requests',
    summary: 'Partners’ requests the caller may read: a partner’s sites, a foreman’s district, or all',
    description: 'Open requests first, newest first within a state.',
    access: allowed('read', 'Request'),
    query: requestListQuerySchema,
    answers: [json(200, 'The requests.', items('Requests'))],
  },
  {
    method: 'post',
    path: '/api/requests',
    tag: 'Requests',
    summary: 'File a request about a field: lines for a game (day and layout), a wet area, damaged turf, a safety concern',
    description: 'A partner files only for fields of their own sites. The district’s foremen are e-mailed.',
    access: allowed('create', 'Request'),
    body: createFieldRequestSchema,
    answers: [json(201, 'The request, requested.', shape({ request: row(REQUEST_ROW) }))],
  },
  {
    method: 'get',
    path: '/api/requests/:id',
    tag: 'Requests',
    summary: 'One request with its thread, photos and the work it became',
    description: 'A request the caller may not read answers 404, as one that does not exist.',
    access: allowed('read', 'Request'),
    params: idParamSchema,
    answers: [json(200, 'The request.', REQUEST_DETAIL)],
  },
  versionedUpdate({
    path: '/api/requests/:id',
    tag: 'Requests',
    summary: 'Change a request while it is still requested (a partner: only what they filed)',
    subject: 'Request',
    body: updateFieldRequestSchema,
    answer: json(200, 'The request after the change.', shape({ request: row(REQUEST_ROW) })),
  }),
  {
    method: 'post',
    path: '/api/requests/:id/messages',
    tag: 'Requests',
    summary: 'Add a message to a request’s thread: the foreman’s answer (e-mailed to the partner who filed) or the partner’s reply (e-mailed to the foremen)',
    access: allowed('update', 'Request'),
    params: idParamSchema,
    body: requestMessageSchema,
    answers: [json(201, 'The request with its thread.', REQUEST_DETAIL)],
  },
  {
    method: 'post',
    path: '/api/requests/:id/schedule',
    tag: 'Requests',
    summary: 'Turn a request into work: a game request becomes a booking the week plan paints lines before; any other kind one work order',
    description: `${VERSION_NOTE} \`work\` (task, day, hours, crew) is required for every kind but lines for a game. The partner is e-mailed; the request is done when its work is.`,
    access: allowed('assign', 'Request'),
    params: idParamSchema,
    body: scheduleFieldRequestSchema,
    answers: [json(200, 'The request, scheduled.', shape({ request: row(REQUEST_ROW) }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/requests/:id/decline',
    tag: 'Requests',
    summary: 'Decline a request with the reason the partner reads',
    description: `${VERSION_NOTE} The partner is e-mailed.`,
    access: allowed('assign', 'Request'),
    params: idParamSchema,
    body: declineFieldRequestSchema,
    answers: [json(200, 'The request, declined.', shape({ request: row(REQUEST_ROW) }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/requests/:id/close',
    tag: 'Requests',
    summary: 'Close a request as done',
    description: `${VERSION_NOTE} The partner is e-mailed.`,
    access: allowed('assign', 'Request'),
    params: idParamSchema,
    body: closeFieldRequestSchema,
    answers: [json(200, 'The request, done.', shape({ request: row(REQUEST_ROW) }))],
    errors: [409],
  },
  {
    method: 'post',
    path: '/api/requests/:id/photos',
    tag: 'Requests',
    summary: 'Add a photo to a request (the partner who filed it, while it is open)',
    description: `The photo is resized to 1,600 px, stored as JPEG without its metadata; at most ${PHOTOS_PER_REQUEST} per request. The caller is checked before the upload is read.`,
    access: allowed('update', 'Request'),
    params: idParamSchema,
    upload: photoUpload(),
    answers: [json(201, 'The photo is stored.', shape({ photo: row('id, width, height, bytes, createdAt and url of the photo') }))],
    errors: [409, 413, 415],
  },
  {
    method: 'get',
    path: '/api/requests/:id/photos/:photoId',
    tag: 'Requests',
    summary: 'The image of a request’s photo',
    access: allowed('read', 'Request'),
    params: requestPhotoParamsSchema,
    answers: [PHOTO_IMAGE],
  },
];

const calendarFeeds: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/calendar-feeds',
    tag: 'Calendar feeds',
    summary: 'The private calendar feeds the caller may have: a partner’s own, or one per crew of a foreman’s district, each with the one that works now',
    description: 'The secret addresses are never shown again; only when each feed was made.',
    access: allowed('read', 'CalendarFeed'),
    answers: [json(200, 'The feeds.', items('[{ kind, crewId, name, feed: { id, createdAt } | null }]'))],
  },
  {
    method: 'post',
    path: '/api/calendar-feeds',
    tag: 'Calendar feeds',
    summary: 'Make a new private calendar feed (a partner: of their fields; a foreman: of a crew of his district, `crewId`); the previous feed of the same owner stops working',
    description: 'The answer carries the secret address once; only a hash of its secret is stored.',
    access: allowed('create', 'CalendarFeed'),
    body: createCalendarFeedSchema,
    answers: [json(201, 'The new feed and its secret address.', shape({ feed: row('{ id, createdAt }'), url: str('The secret iCalendar address, shown this once') }))],
  },
  {
    method: 'delete',
    path: '/api/calendar-feeds/:id',
    tag: 'Calendar feeds',
    summary: 'Revoke a calendar feed: its address answers 404 from now on',
    access: allowed('delete', 'CalendarFeed'),
    params: idParamSchema,
    answers: [noContent('The feed is revoked.')],
  },
  {
    method: 'get',
    path: '/api/calendar/:token.ics',
    tag: 'Calendar feeds',
    summary: 'A private calendar feed (iCalendar) in the department’s time zone: a partner’s bookings, game-day line painting and mowing, and closures; or a crew’s work and its fields’ closures',
    description: 'No sign-in: the secret in the address is the key. An unknown or revoked secret answers 404.',
    access: publicAccess('The secret address'),
    params: calendarTokenParamsSchema,
    answers: [{ status: 200, description: 'The calendar.', contentType: 'text/calendar', body: { type: 'string' } }],
    errors: [404],
  },
];

const overview: RouteDoc[] = [
  {
    method: 'get',
    path: '/api/overview',
    tag: 'Overview',
    summary: 'The department head’s overview per district and for the department (a foreman: his own district only)',
    description:
      'Acres by level, labour planned against done (this week and the season), mowings on time, late and missed by the one-third rule, N applied against the feed plan, water against the water budget, paint, the mean surface score and fields below target per level, open requests and closures. A foreman asking for another district gets 403; without a district he gets his own.',
    access: allowed('read', 'Overview', { probe: (actor) => ({ districtId: actor.districtId }) }),
    query: overviewQuerySchema,
    answers: [
      json(
        200,
        'Quantities in SI units (m², h, kg N, L), per district and in total.',
        shape({
          season: int('The season year'),
          seasonFrom: date(),
          seasonTo: date(),
          weekFrom: date('Monday of the department’s current week'),
          weekTo: date(),
          asOf: date('The department’s today'),
          districtId: nullable(int()),
          total: row('The whole of what was asked'),
          districts: rows('One block per district'),
        }),
      ),
    ],
    errors: [404],
  },
];

export const ROUTES: readonly RouteDoc[] = [
  ...service,
  ...auth,
  ...users,
  ...weather,
  ...workOrders,
  ...weekPlans,
  ...overview,
  ...sites,
  ...fields,
  ...fieldEvents,
  ...closures,
  ...stripes,
  ...linePlans,
  ...logos,
  ...gameDays,
  ...partner,
  ...calendarFeeds,
  ...requests,
  ...standards,
  ...settings,
  ...costs,
  ...budget,
  ...compare,
  ...imports,
  ...map,
  ...directory,
  ...crews,
  ...mailOutbox,
  ...dev,
];
