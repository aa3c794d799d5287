/** Settings read once from the environment; every default suits the demo on one machine. */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_TIME_ZONE, isTimeZone } from '@swardwise/domain';

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
  /** Map tile URL template ({z}/{x}/{y}); unset: the portal draws the bundled vector basemap and no request leaves the machine. */
  mapTileUrl: string | undefined;
  /** Attribution shown with the tiles of `mapTileUrl`. */
  mapAttribution: string | undefined;
  /** Outgoing mail server; null when SMTP_HOST is unset. */
  smtp: { host: string; port: number; secure: boolean; user: string | undefined; pass: string | undefined } | null;
  mailFrom: string;
  /** Run the local SMTP sink (development only, when no SMTP_HOST is set). */
  mailSink: boolean;
  mailSinkPort: number;
  /** Hosted weather service (our client's format); unset: station files only. */
  weatherApiUrl: string | undefined;
  weatherApiKey: string | undefined;
  weatherTimeoutMs: number;
  /** Folder of uploaded files (crews' work photos), created on first use. */
  uploadsDir: string;
  /** The department's IANA time zone until an administrator sets one in the settings. */
  departmentTimeZone: string;
}

function bool(value: string | undefined, fallback: boolean): boolean {
  if (value === undefined || value === '') return fallback;
  return ['1', 'true', 'yes', 'on'].includes(value.toLowerCase());
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a port number, got "${env.PORT}"`);
  const departmentTimeZone = env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE;
  if (!isTimeZone(departmentTimeZone)) {
    throw new Error(`DEPARTMENT_TIME_ZONE must be an IANA time zone such as America/Chicago, got "${env.DEPARTMENT_TIME_ZONE}"`);
  }
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
    mapTileUrl: env.MAP_TILE_URL || undefined,
    mapAttribution: env.MAP_ATTRIBUTION || undefined,
    smtp: env.SMTP_HOST
      ? {
          host: env.SMTP_HOST,
          port: Number(env.SMTP_PORT ?? 587),
          secure: bool(env.SMTP_SECURE, false),
          user: env.SMTP_USER || undefined,
          pass: env.SMTP_PASS || undefined,
        }
      : null,
    mailFrom: env.MAIL_FROM ?? 'Swardwise <no-reply@swardwise.example>',
    mailSink: !env.SMTP_HOST && bool(env.MAIL_SINK, env.NODE_ENV !== 'production'),
    mailSinkPort: Number(env.MAIL_SINK_PORT ?? 2525),
    weatherApiUrl: env.WEATHER_API_URL || undefined,
    weatherApiKey: env.WEATHER_API_KEY || undefined,
    weatherTimeoutMs: Number(env.WEATHER_TIMEOUT_MS ?? 10_000),
    uploadsDir: path.resolve(env.UPLOADS_DIR ?? './data/uploads'),
    departmentTimeZone,
  };
}
