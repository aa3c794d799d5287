import { ApiError } from './client.ts';

/** What the portal tells people for the error codes it expects; anything else shows the server's message. */
const MESSAGES: Record<string, string> = {
  'auth/invalid_credentials': 'The e-mail or password is not right. Check both and try again.',
  'auth/rate_limited': 'Too many sign-in attempts. Wait a few minutes before trying again.',
  'auth/unauthenticated': 'Your session has ended. Sign in again.',
  'auth/forbidden': 'This is outside what your account may see or change.',
  'auth/invalid_token': 'This invitation link is not valid any more. Ask your administrator for a new one.',
  'auth/deactivated': 'This account has been deactivated. Ask your administrator if you need access again.',
  'user/version_conflict': 'Someone else changed this user in the meantime. Reload the list and make your change again.',
  'network/unreachable': 'The server cannot be reached. Check your connection and try again.',
};

export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) {
    if (MESSAGES[error.code]) return MESSAGES[error.code]!;
    if (error.status === 429) return MESSAGES['auth/rate_limited']!;
    if (error.code.endsWith('/version_conflict')) return 'Someone else changed this in the meantime. Reload and try again.';
    if (error.code.endsWith('/not_found')) return 'This item does not exist, or it is outside what your role may see.';
    return error.message;
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/** Field-level messages of a 400, keyed by the form field (the `body.` prefix dropped). */
export function fieldIssues(error: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (!(error instanceof ApiError)) return out;
  for (const issue of error.issues) {
    const key = issue.path.replace(/^body\./, '').split('.')[0] ?? issue.path;
    out[key] ??= issue.message;
  }
  return out;
}
