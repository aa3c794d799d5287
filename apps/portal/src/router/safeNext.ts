/**
 * Where to go after signing in. Its own module: the sign-in page needs it, and importing it
 * from the router would import the router's lazy routes, the sign-in page among them.
 */

/** A `next` query value is only followed when it stays inside the portal. */
export function safeNext(next: unknown): string | null {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : null;
}
