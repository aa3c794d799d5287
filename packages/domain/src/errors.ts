/**
 * One error model for the whole product. Codes are namespaced by resource
 * (`field/not_found`); the API maps a code's kind to an HTTP status and the portal
 * maps codes to messages.
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
  unavailable: 503,
};

export interface FieldIssue {
  /** Dotted path of the offending input, e.g. `body.email` or `query.page`. */
  path: string;
  message: string;
}

export interface ErrorBody {
  error: {
    code: string;
    message: string;
    details?: { issues?: FieldIssue[] } & Record<string, unknown>;
  };
}

/** An error raised by a service or route: carries a code, a kind (HTTP status) and details. */
export class AppError extends Error {
  readonly code: string;
  readonly kind: ErrorKind;
  readonly details: ErrorBody['error']['details'];

  constructor(kind: ErrorKind, code: string, message: string, details?: ErrorBody['error']['details']) {
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
  readonly code: string;
  readonly details: Record<string, unknown> | undefined;

  constructor(code: string, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = 'DomainError';
    this.code = code;
    this.details = details;
  }
}
