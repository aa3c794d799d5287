/** Settings read once from the environment; every default suits the demo on one machine. */
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

export interface Config {
  port: number;
  host: string;
  production: boolean;
  /** PostgreSQL server URL; when unset the embedded PGlite folder is used. */
  databaseUrl: string | undefined;
  pgliteDir: string;
  /** Signs the session cookie; when unset a random secret is generated and kept in the database. */
  sessionSecret: string | undefined;
  /** Public address of the portal, used in invitation links. */
  publicUrl: string;
  cookieSecure: boolean;
  logLevel: string;
  seedDemo: boolean;
  /** Sign-in attempts allowed per IP address and e-mail within the window. */
  loginAttempts: number;
  loginWindowMs: number;
  portalDist: string;
}

function bool(value: string | undefined, fallback: boolean): boolean {
  if (value === undefined || value === '') return fallback;
  return ['1', 'true', 'yes', 'on'].includes(value.toLowerCase());
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a port number, got "${env.PORT}"`);
  return {
    port,
    host: env.HOST ?? '0.0.0.0',
    production: env.NODE_ENV === 'production',
    databaseUrl: env.DATABASE_URL || undefined,
    pgliteDir: path.resolve(env.PGLITE_DIR ?? './data/pglite'),
    sessionSecret: env.SESSION_SECRET || undefined,
    publicUrl: (env.PUBLIC_URL ?? `http://localhost:${port}`).replace(/\/$/, ''),
    cookieSecure: bool(env.COOKIE_SECURE, false),
    logLevel: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    seedDemo: bool(env.SEED_DEMO, true),
    loginAttempts: Number(env.LOGIN_ATTEMPTS ?? 10),
    loginWindowMs: Number(env.LOGIN_WINDOW_MINUTES ?? 15) * 60_000,
    portalDist: path.resolve(env.PORTAL_DIST ?? path.join(repoRoot, 'apps/portal/dist')),
  };
}
