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
  /** Public address of the portal, used in invitation links; its origin is the one browsers may write from. */
  publicUrl: string;
  /** PUBLIC_URL was set; unset, a write is also accepted from the address the browser used (Host). */
  publicUrlSet: boolean;
  /** Origins a browser may send writes (POST, PUT, PATCH, DELETE) from. */
  allowedOrigins: string[];
  /** Express `trust proxy`: which proxy's X-Forwarded-* headers to believe; false trusts none. */
  trustProxy: false | number | string;
  cookieSecure: boolean;
  logLevel: string;
  /** Demo mode: seed the invented demo city into an empty database and say so in the log and on the sign-in page. */
  demo: boolean;
  /** First administrator of a new installation without the demo. */
  adminEmail: string | undefined;
  adminPassword: string | undefined;
  /** Failed sign-ins allowed per account (from any address) within the window. */
  loginAttempts: number;
  /** Failed sign-ins, invitation and reset-link attempts allowed per client address within the window. */
  loginAttemptsPerAddress: number;
  loginWindowMs: number;
  /** Password-reset requests allowed per account and per address within their window, answered or not. */
  resetRequestsPerAccount: number;
  resetRequestsPerAddress: number;
  resetWindowMs: number;
  /** A session ends this long after its last request… */
  sessionIdleMs: number;
  /** …and this long after sign-in, however busy. */
  sessionMaxMs: number;
  /**
   * How long a process trusts a session or user it read (AUTH_CACHE_SECONDS, default 5; 0: not
   * at all): a sign-out, deactivation or role change made through another API process takes
   * effect here within this bound (at once on the process that made it).
   */
  authCacheMs: number;
  /** A session in use has its expiry written at most this often (SESSION_TOUCH_SECONDS, default 60). */
  sessionTouchMs: number;
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
  mailRetryIntervalMs: number;
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

function nonNegative(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value < 0) throw new Error(`${name} must be zero or a positive number, got "${raw}"`);
  return value;
}

function positive(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`${name} must be a positive number, got "${raw}"`);
  return value;
}

/**
 * TRUST_PROXY names the proxy in front of the server: `loopback`, an address or subnet list
 * (`10.0.0.1, 172.16.0.0/12`) or a hop count. Unset: no X-Forwarded-* header is believed, so
 * a client cannot pick its own address for the sign-in limits. Trusting every sender is refused.
 */
function trustProxyOf(raw: string | undefined): false | number | string {
  const value = raw?.trim() ?? '';
  if (value === '' || ['false', 'no', 'off', '0', 'none'].includes(value.toLowerCase())) return false;
  if (['true', 'yes', 'on', 'all', '*'].includes(value.toLowerCase())) {
    throw new Error('TRUST_PROXY must name the proxy (an address, a subnet, "loopback" or a hop count), not trust every sender');
  }
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

/** The Vite dev server (`npm run dev`, strict port 5173) the browser uses in development. */
export const DEV_PORTAL_ORIGINS = ['http://localhost:5173', 'http://127.0.0.1:5173'];

export function loadConfig(env: NodeJS.ProcessEnv = process.env, argv: string[] = []): Config {
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a port number, got "${env.PORT}"`);
  const departmentTimeZone = env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE;
  if (!isTimeZone(departmentTimeZone)) {
    throw new Error(`DEPARTMENT_TIME_ZONE must be an IANA time zone such as America/Chicago, got "${env.DEPARTMENT_TIME_ZONE}"`);
  }
  const production = env.NODE_ENV === 'production';
  const publicUrl = (env.PUBLIC_URL || `http://localhost:${port}`).replace(/\/$/, '');
  let publicOrigin: string;
  try {
    publicOrigin = new URL(publicUrl).origin;
  } catch {
    throw new Error(`PUBLIC_URL must be the portal's address (https://parks.example.org), got "${env.PUBLIC_URL}"`);
  }
  // The demo city is never seeded in production unless asked for (`--demo`, DEMO=true);
  // SEED_DEMO is its former name.
  const demo = argv.includes('--demo') || bool(env.DEMO ?? env.SEED_DEMO, !production);
  const days = 24 * 3600 * 1000;
  const cookieSecure = bool(env.COOKIE_SECURE, false);
  const trustProxy = trustProxyOf(env.TRUST_PROXY);
  // The server speaks plain HTTP; HTTPS is a proxy's. Without trusting that proxy's
  // X-Forwarded-Proto every request looks like http and the secure cookie is never sent.
  if (cookieSecure && trustProxy === false) {
    throw new Error('COOKIE_SECURE=true needs TRUST_PROXY naming the HTTPS proxy in front of this server (for example TRUST_PROXY=loopback)');
  }
  return {
    port,
    host: env.HOST ?? '0.0.0.0',
    production,
    databaseUrl: env.DATABASE_URL || undefined,
    pgliteDir: path.resolve(env.PGLITE_DIR ?? './data/pglite'),
    sessionSecret: env.SESSION_SECRET || undefined,
    publicUrl,
    publicUrlSet: Boolean(env.PUBLIC_URL),
    allowedOrigins: [...new Set([publicOrigin, ...(production ? [] : DEV_PORTAL_ORIGINS)])],
    trustProxy,
    cookieSecure,
    logLevel: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    demo,
    adminEmail: env.ADMIN_EMAIL?.trim() || undefined,
    adminPassword: env.ADMIN_PASSWORD || undefined,
    loginAttempts: positive(env, 'LOGIN_ATTEMPTS', 10),
    loginAttemptsPerAddress: positive(env, 'LOGIN_ATTEMPTS_PER_ADDRESS', 50),
    loginWindowMs: positive(env, 'LOGIN_WINDOW_MINUTES', 15) * 60_000,
    resetRequestsPerAccount: positive(env, 'RESET_REQUESTS_PER_ACCOUNT', 3),
    resetRequestsPerAddress: positive(env, 'RESET_REQUESTS_PER_ADDRESS', 10),
    resetWindowMs: positive(env, 'RESET_WINDOW_MINUTES', 60) * 60_000,
    sessionIdleMs: positive(env, 'SESSION_IDLE_DAYS', 14) * days,
    sessionMaxMs: positive(env, 'SESSION_MAX_DAYS', 30) * days,
    authCacheMs: nonNegative(env, 'AUTH_CACHE_SECONDS', 5) * 1000,
    sessionTouchMs: nonNegative(env, 'SESSION_TOUCH_SECONDS', 60) * 1000,
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
    /** How often the mail outbox looks for messages due for another attempt. */
    mailRetryIntervalMs: Number(env.MAIL_RETRY_INTERVAL_MS ?? 15_000),
    weatherApiUrl: env.WEATHER_API_URL || undefined,
    weatherApiKey: env.WEATHER_API_KEY || undefined,
    weatherTimeoutMs: Number(env.WEATHER_TIMEOUT_MS ?? 10_000),
    uploadsDir: path.resolve(env.UPLOADS_DIR ?? './data/uploads'),
    departmentTimeZone,
  };
}
