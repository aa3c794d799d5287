import type { ErrorBody, FieldIssue } from '@swardwise/domain';

/**
 * Codes the portal gives a failure itself: no answer at all, or an answer without the API's
 * error shape (`http/<status>`, e.g. a proxy refusing a large body).
 */
export type ClientErrorCode = 'network/unreachable' | `http/${number}`;

/** An error answer of the API (or a network failure, code `network/unreachable`). */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly issues: FieldIssue[];

  constructor(status: number, code: string, message: string, issues: FieldIssue[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.issues = issues;
  }
}

type Query = Record<string, string | number | boolean | null | undefined>;

interface RequestOptions {
  query?: Query;
  body?: unknown;
  signal?: AbortSignal;
}

function withQuery(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

function isErrorBody(value: unknown): value is ErrorBody {
  const error = (value as ErrorBody | null)?.error;
  return typeof error === 'object' && error !== null && typeof error.code === 'string';
}

export const UNREACHABLE = 'The server cannot be reached. Check your connection and try again.';

/**
 * The error of a failed answer: the API's own error shape when it sent one, else one coded
 * `http/<status>` (a proxy in front of the API may refuse a large body or a crash itself).
 */
export function errorOf(status: number, statusText: string, payload: unknown): ApiError {
  if (isErrorBody(payload)) {
    const { code, message, details } = payload.error;
    return new ApiError(status, code, message, details?.issues ?? []);
  }
  return new ApiError(status, `http/${status}`, `The server answered ${status}${statusText ? ` ${statusText}` : ''}.`);
}

async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const init: RequestInit = {
    method,
    credentials: 'same-origin',
    headers: { Accept: 'application/json' },
    signal: options.signal,
  };
  if (options.body instanceof FormData) {
    // The browser sets the multipart boundary itself.
    init.body = options.body;
  } else if (options.body !== undefined) {
    init.headers = { ...init.headers, 'Content-Type': 'application/json' };
    init.body = JSON.stringify(options.body);
  }

  let response: Response;
  try {
    response = await fetch(withQuery(`/api${path}`, options.query), init);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network/unreachable', UNREACHABLE);
  }

  if (response.status === 204) return undefined as T;
  const text = await response.text();
  let payload: unknown = undefined;
  if (text) {
    try {
      payload = JSON.parse(text);
    } catch {
      // A proxy or a crashed server can answer with HTML; treat it as an unreadable answer below.
    }
  }

  if (!response.ok) throw errorOf(response.status, response.statusText, payload);
  return payload as T;
}

export const api = {
  get: <T>(path: string, query?: Query, signal?: AbortSignal) => request<T>('GET', path, { query, signal }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  /** A multipart upload (files and fields in a FormData). */
  upload: <T>(path: string, form: FormData) => request<T>('POST', path, { body: form }),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
};
