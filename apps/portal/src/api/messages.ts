import type { ApiErrorCode, VersionedResource } from '@swardwise/domain';
import { ApiError, type ClientErrorCode } from './client.ts';

/** What a resource is called in a message, by the namespace of its error codes (`field_event/…`). */
const NOUNS: Partial<Record<VersionedResource, string>> = {
  user: 'user',
  site: 'site',
  field: 'field',
  field_event: 'booking',
  crew: 'crew',
  equipment: 'machine',
  work_order: 'work order',
  standards: 'level',
  field_stripes: 'stripe pattern',
  field_line_plan: 'line plan',
  field_request: 'request',
  budget_line: 'budget line',
};

/** Someone saved the row after this person read it (the API's `<resource>/version_conflict`, 409). */
const conflict = (noun: string) => `Someone else changed this ${noun} since you opened it; reload to see their change, then make yours again.`;

const CONFLICTS = Object.fromEntries(Object.entries(NOUNS).map(([resource, noun]) => [`${resource}/version_conflict`, conflict(noun)])) as Partial<
  Record<`${VersionedResource}/version_conflict`, string>
>;

/**
 * What the portal tells people for the error codes it expects; any other code shows the server's
 * message. Keyed by the API's own codes (a code it does not send does not compile).
 */
export const MESSAGES: Partial<Record<ApiErrorCode | ClientErrorCode, string>> = {
  'auth/invalid_credentials': 'The e-mail or password is not right. Check both and try again.',
  'auth/rate_limited': 'Too many sign-in attempts. Wait a few minutes before trying again.',
  'auth/unauthenticated': 'Your session has ended. Sign in again.',
  'auth/forbidden': 'This is outside what your account may see or change.',
  'auth/invalid_token': 'This invitation link is not valid any more. Ask your administrator for a new one.',
  'auth/deactivated': 'This account has been deactivated. Ask your administrator if you need access again.',
  'auth/access_changed': 'An administrator changed your account’s access, which signed you out. Sign in again to continue with your new access; if you cannot, ask them.',
  'http/413': 'The file is too large to upload.',
  ...CONFLICTS,
};

const known = (code: string) => MESSAGES[code as ApiErrorCode | ClientErrorCode];

/** The message of an error code, or undefined when the portal has none of its own for it. */
export function messageFor(code: string): string | undefined {
  const own = known(code);
  if (own) return own;
  if (code.endsWith('/version_conflict')) return conflict('item');
  if (code.endsWith('/not_found')) return 'This item does not exist, or it is outside what your role may see.';
  return undefined;
}

/** An error answer of the API with this code. */
export function hasCode(error: unknown, code: ApiErrorCode): error is ApiError {
  return error instanceof ApiError && error.code === code;
}

/** A stale write: the row changed since it was read (reload, then make the change again). */
export function isConflict(error: unknown): error is ApiError {
  return error instanceof ApiError && error.code.endsWith('/version_conflict');
}

export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 429 && !known(error.code)) return MESSAGES['auth/rate_limited']!;
    return messageFor(error.code) ?? error.message;
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/**
 * Field-level messages of a 400, keyed by the form field: the `body.` prefix dropped and, unless
 * `nested`, only the first segment kept (`body.hocMm.soccer.cool` → `hocMm`).
 */
export function fieldIssues(error: unknown, nested = false): Record<string, string> {
  const out: Record<string, string> = {};
  if (!(error instanceof ApiError)) return out;
  for (const issue of error.issues) {
    const path = issue.path.replace(/^body\./, '');
    const key = nested ? path : (path.split('.')[0] ?? path);
    out[key] ??= issue.message;
  }
  return out;
}
