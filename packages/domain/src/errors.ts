/**
 * One error model for the whole product. Codes are namespaced by resource
 * (`field/not_found`); every code the API answers with is listed in `ERROR_CODES` with its
 * kind (so its HTTP status), errors are made by the factories below so an unknown code does
 * not compile, and the portal maps codes to messages.
 */

export type ErrorKind =
  | 'invalid'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'unsupported'
  | 'rate_limited'
  | 'internal'
  | 'unavailable';

export const ERROR_STATUS: Record<ErrorKind, number> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported: 415,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
};

/** Resources whose rows can be missing: `<resource>/not_found` (404). */
export const NOT_FOUND_RESOURCES = ['route', 'district', 'site', 'field', 'field_event', 'crew', 'equipment', 'work_order', 'work_photo', 'field_check', 'import', 'standards', 'user', 'weather_station', 'calendar_feed', 'field_request', 'request_photo', 'field_logo', 'game_day', 'what_if_scenario'] as const;
export type NotFoundResource = (typeof NOT_FOUND_RESOURCES)[number];

/** Resources written with a version check: `<resource>/version_conflict` (409). */
export const VERSIONED_RESOURCES = ['site', 'field', 'field_event', 'crew', 'equipment', 'work_order', 'standards', 'settings', 'user', 'field_stripes', 'field_request', 'field_line_plan', 'field_logo', 'game_day', 'budget_line'] as const;
export type VersionedResource = (typeof VERSIONED_RESOURCES)[number];

/** Routes that take a file upload: `<resource>/too_large` (413) and `<resource>/bad_upload` (400). */
export const UPLOAD_RESOURCES = ['import', 'weather', 'work_photo', 'request_photo', 'field_logo'] as const;
export type UploadResource = (typeof UPLOAD_RESOURCES)[number];

/** `<resource>/<suffix>` for each resource, all of one kind. */
function each<R extends string, S extends string, K extends ErrorKind>(resources: readonly R[], suffix: S, kind: K): { [C in `${R}/${S}`]: K } {
  return Object.fromEntries(resources.map((r) => [`${r}/${suffix}`, kind])) as { [C in `${R}/${S}`]: K };
}

/** Every code the API answers with, and its kind. */
export const ERROR_CODES = {
  'request/invalid': 'invalid',
  'request/malformed_json': 'invalid',
  'request/too_deep': 'invalid',
  'request/too_large': 'too_large',
  'request/cross_origin': 'forbidden',
  'server/internal': 'internal',

  'auth/unauthenticated': 'unauthenticated',
  'auth/invalid_credentials': 'unauthenticated',
  'auth/invalid_token': 'invalid',
  'auth/forbidden': 'forbidden',
  'auth/deactivated': 'forbidden',
  'auth/access_changed': 'unauthenticated',
  'auth/rate_limited': 'rate_limited',

  ...each(NOT_FOUND_RESOURCES, 'not_found', 'not_found'),
  ...each(VERSIONED_RESOURCES, 'version_conflict', 'conflict'),
  ...each(UPLOAD_RESOURCES, 'too_large', 'too_large'),
  ...each(UPLOAD_RESOURCES, 'bad_upload', 'invalid'),

  'user/email_taken': 'conflict',
  'user/self_lockout': 'invalid',
  'user/forbidden_attribute': 'forbidden',
  'crew/has_lead': 'conflict',
  'field/has_work_history': 'conflict',
  'field/not_closed': 'conflict',
  'field/retired': 'conflict',

  'work_order/logged': 'conflict',
  'week_plan/changed': 'conflict',
  'work_report/client_ref_taken': 'conflict',
  'work_report/already_done': 'conflict',
  'work_report/not_finished': 'conflict',
  'work_report/field_closed': 'conflict',
  'field_check/not_a_check': 'conflict',
  'application/not_applicable': 'conflict',
  'field_check/photos_on_order': 'conflict',
  'work_photo/no_file': 'invalid',
  'work_photo/not_an_image': 'unsupported',
  'work_photo/unsupported_format': 'unsupported',
  'work_photo/unreadable': 'unsupported',
  'work_photo/too_many_pixels': 'too_large',
  'work_photo/too_many': 'conflict',
  'work_photo/file_missing': 'not_found',

  'mail/not_found': 'not_found',
  'mail/not_failed': 'conflict',
  'field_request/not_open': 'conflict',
  'game_day/exists': 'conflict',
  'game_day/past_event': 'invalid',
  'game_day/colourant_missing': 'invalid',
  'field_request/past_game': 'invalid',
  'field_request/layout': 'invalid',
  'request_photo/no_file': 'invalid',
  'request_photo/not_an_image': 'unsupported',
  'request_photo/unsupported_format': 'unsupported',
  'request_photo/unreadable': 'unsupported',
  'request_photo/too_many_pixels': 'too_large',
  'request_photo/too_many': 'conflict',
  'request_photo/file_missing': 'not_found',

  'field_logo/no_file': 'invalid',
  'field_logo/not_an_image': 'unsupported',
  'field_logo/unsupported_format': 'unsupported',
  'field_logo/unsafe_svg': 'unsupported',
  'field_logo/unreadable': 'unsupported',
  'field_logo/too_many_pixels': 'too_large',
  'field_logo/no_colours': 'invalid',
  'field_logo/too_many': 'conflict',
  'field_logo/file_missing': 'not_found',

  'import/no_file': 'invalid',
  'import/unsupported_type': 'unsupported',
  'import/empty': 'invalid',
  'import/columns': 'invalid',
  'import/too_deep': 'invalid',
  'import/too_many_rows': 'too_large',
  'import/not_preview': 'conflict',
  'import/has_errors': 'conflict',
  'import/stale': 'conflict',
  'import/not_committed': 'conflict',
  'import/not_last': 'conflict',
  'import/changed_since': 'conflict',

  'weather/no_file': 'invalid',
  'weather/not_csv': 'unsupported',
  'weather/csv_columns': 'invalid',
  'weather/csv_has_errors': 'invalid',
  'weather/none': 'not_found',
  'weather/malformed_rows': 'unavailable',
  'weather/not_configured': 'unavailable',
  'weather/timeout': 'unavailable',
  'weather/unreachable': 'unavailable',
  'weather/rejected_key': 'unavailable',
  'weather/upstream_error': 'unavailable',
  'weather/malformed': 'unavailable',
} as const satisfies Record<string, ErrorKind>;

/** A code listed in `ERROR_CODES`. */
export type ApiErrorCode = keyof typeof ERROR_CODES;

/**
 * Codes of a bad input to a pure computation (`DomainError`): the engine names its own
 * (`engine/negative_area`) and the API answers every one of them as 400.
 */
export type DomainErrorCode = `engine/${string}` | `geometry/${string}`;

/** Every code an error answer of the API can carry. */
export type ErrorCode = ApiErrorCode | DomainErrorCode;

/** The codes of one kind. */
export type CodesOfKind<K extends ErrorKind> = { [C in ApiErrorCode]: (typeof ERROR_CODES)[C] extends K ? C : never }[ApiErrorCode];

type WeatherSuffix<C> = C extends `weather/${infer S}` ? S : never;
/** What went wrong with the hosted weather service (`weather/<code>`, 503). */
export type WeatherServiceCode = WeatherSuffix<CodesOfKind<'unavailable'>>;

export function isApiErrorCode(code: string): code is ApiErrorCode {
  return Object.hasOwn(ERROR_CODES, code);
}

/** The kind of a code: its entry in `ERROR_CODES`; a domain code is a bad input. */
export function kindOf(code: ErrorCode): ErrorKind {
  return isApiErrorCode(code) ? ERROR_CODES[code] : 'invalid';
}

export interface FieldIssue {
  /** Dotted path of the offending input, e.g. `body.email` or `query.page`. */
  path: string;
  message: string;
}

export type ErrorDetails = { issues?: FieldIssue[] } & Record<string, unknown>;

export interface ErrorBody {
  error: {
    code: ErrorCode;
    message: string;
    details?: ErrorDetails;
  };
}

/** An error raised by a service or route: carries a code, its kind (HTTP status) and details. Made by the factories below. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly kind: ErrorKind;
  readonly details: ErrorDetails | undefined;

  constructor(code: ErrorCode, message: string, details?: ErrorDetails, kind: ErrorKind = kindOf(code)) {
    super(message);
    this.name = 'AppError';
    this.kind = kind;
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return ERROR_STATUS[this.kind];
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.details ? { details: this.details } : {}) } };
  }
}

/**
 * A bad input to a pure computation (negative area, unknown grass, a temperature out of
 * physical range). The engine throws it; the API turns it into a 400.
 */
export class DomainError extends Error {
  readonly code: DomainErrorCode;
  readonly details: Record<string, unknown> | undefined;

  constructor(code: DomainErrorCode, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = 'DomainError';
    this.code = code;
    this.details = details;
  }
}

/** An error with a listed code; its status follows from the code. */
export function appError(code: ApiErrorCode, message: string, details?: ErrorDetails): AppError {
  return new AppError(code, message, details);
}

const SIGN_IN = 'Sign in to continue';
const WRONG_CREDENTIALS = 'The e-mail or password is not right';
const DEACTIVATED = 'This account has been deactivated; ask your administrator if you need access again';
const ACCESS_CHANGED = {
  access_changed: 'An administrator changed what your account may do; sign in again to continue with your new access',
  deactivated: 'An administrator deactivated your account, which signed you out; ask them if you need access again',
} as const;
/** How a resource is named in a message where its code name would read badly. */
const WORDS: Partial<Record<NotFoundResource, string>> = { weather_station: 'weather station', field_check: 'field check', calendar_feed: 'calendar feed', game_day: 'game-day preparation', what_if_scenario: 'saved what-if' };

/** The errors that many places raise, each written once. */
export const errors = {
  /** 404: no row with this id (or none the caller may see). */
  notFound: (resource: NotFoundResource, id: number) => appError(`${resource}/not_found`, `No ${WORDS[resource] ?? resource} with id ${id}`),
  /** 404: no route at this method and path. */
  noRoute: (method: string, path: string) => appError('route/not_found', `No route at ${method} ${path}`),
  /** 409: the row changed since the caller read it. */
  versionConflict: (resource: VersionedResource) =>
    appError(`${resource}/version_conflict`, `Someone else changed this ${resource} since you opened it; reload to see their change, then apply yours again`),
  /** 403: the caller's role or scope does not allow this. */
  forbidden: (message: string) => appError('auth/forbidden', message),
  unauthenticated: () => appError('auth/unauthenticated', SIGN_IN),
  invalidCredentials: () => appError('auth/invalid_credentials', WRONG_CREDENTIALS),
  deactivated: () => appError('auth/deactivated', DEACTIVATED),
  /** 401: an administrator changed the account's role or scope, or deactivated it, which ended its sessions. */
  accessChanged: (reason: keyof typeof ACCESS_CHANGED) => appError('auth/access_changed', ACCESS_CHANGED[reason]),
  /** 400 with one issue per bad input. */
  invalid: (message: string, issues: FieldIssue[]) => appError('request/invalid', message, { issues }),
  /** 400: the body names a row that does not exist (`No such site`, at `body.siteId`). */
  noSuch: (noun: string, path: string) => appError('request/invalid', `No such ${noun}`, { issues: [{ path, message: `no such ${noun}` }] }),
  /** A refusal of the HTTP layer (a bad path encoding, a body in an encoding it cannot read): 400, or 415 for the encoding. */
  refusedRequest: (status: number, message: string) => new AppError('request/invalid', message, undefined, status === 415 ? 'unsupported' : 'invalid'),
  /** 400: a bad input to a computation. */
  fromDomain: (err: DomainError) => new AppError(err.code, err.message, err.details),
  /** 500: anything not foreseen; the answer says nothing of the cause. */
  internal: () => appError('server/internal', 'Something went wrong on the server; nothing was saved'),
  /** 503: the weather service failed. */
  weatherService: (code: WeatherServiceCode, message: string) => appError(`weather/${code}`, message),
};
