/**
 * Writes only from the portal's own pages. SameSite=Lax cookies still travel with requests
 * from another port of the same host (same site, other origin), and multipart or body-less
 * POSTs need no CORS preflight, so every POST, PUT, PATCH and DELETE must come from an
 * allowed origin: PUBLIC_URL's, the Vite dev server's in development and, while PUBLIC_URL
 * is unset, the address the browser itself used (Host). The Origin header decides; lacking
 * it, the Referer's origin. A request with neither is not from a browser page (browsers
 * send Origin on every cross-origin write): curl, scripts, server-to-server calls and
 * supertest pass, and still need a session cookie for anything but signing in.
 */
import type { Request, RequestHandler } from 'express';
import { type AppError, appError } from '@swardwise/domain';
import type { Config } from '../config.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(value: string): string | null {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:' ? url.origin : null;
  } catch {
    return null;
  }
}

/** The origin a browser request was made from, `null` when it says but it is opaque, undefined when it does not say. */
function requestOrigin(req: Request): string | null | undefined {
  const origin = req.get('origin');
  if (origin !== undefined) return origin === 'null' ? null : originOf(origin);
  const referer = req.get('referer');
  if (referer !== undefined) return originOf(referer);
  return undefined;
}

export function sameOriginWrites(config: Pick<Config, 'allowedOrigins' | 'publicUrlSet'>): RequestHandler {
  const allowed = new Set(config.allowedOrigins);
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = requestOrigin(req);
    if (origin === undefined) {
      // No Origin and no Referer: only a browser that says it is cross-site is refused.
      const site = req.get('sec-fetch-site');
      if (site === 'cross-site' || site === 'same-site') return next(refused());
      return next();
    }
    if (origin !== null && allowed.has(origin)) return next();
    if (origin !== null && !config.publicUrlSet && new URL(origin).host === req.get('host')) return next();
    next(refused());
  };
}

function refused(): AppError {
  return appError('request/cross_origin', 'This change must be made from the Swardwise portal itself; the request came from another site or address');
}
