/**
 * The HTTP application, top to bottom as one pipeline: security headers, compression, logs,
 * the origin of writes, sessions, the caller's identity, body parsing (bounded by who is
 * asking), the API routes, the built portal, errors.
 */
import fs from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { appError } from '@swardwise/domain';
import type { AppDeps } from './app-deps.ts';
import type { Config } from './config.ts';
import { createMailer, type Mailer } from './mail/mailer.ts';
import { MailOutbox, type OutboxOptions } from './mail/outbox.ts';
import { forgetAfterWrites, loadUser, requireUser } from './http/auth.ts';
import { AuthCache } from './http/auth-cache.ts';
import { withClock } from './http/clock.ts';
import { errorHandler, noRoute } from './http/errors.ts';
import { MAX_JSON_DEPTH, nestedDeeperThan } from './http/json-depth.ts';
import { portalRouter } from './http/portal.ts';
import { loggableUrl } from './http/request-log.ts';
import { sameOriginWrites } from './http/same-origin.ts';
import { sessionLifetime } from './http/session-lifetime.ts';
import { DrizzleSessionStore } from './http/session-store.ts';
import { serveOpenApi } from './openapi/document.ts';
import { BackgroundTasks } from './services/background.ts';
import { demoAnnouncement } from './services/first-run.ts';
import { authRouter } from './routes/auth.ts';
import { calendarFeedsRouter, calendarPublicRouter } from './routes/calendar-feeds.ts';
import { closuresRouter } from './routes/closures.ts';
import { stripesRouter } from './routes/stripes.ts';
import { linePlansRouter } from './routes/line-plans.ts';
import { logosRouter } from './routes/logos.ts';
import { crewsRouter } from './routes/crews.ts';
import { devRouter } from './routes/dev.ts';
import { directoryRouter } from './routes/directory.ts';
import { fieldEventsRouter } from './routes/field-events.ts';
import { fieldsRouter } from './routes/fields.ts';
import { gameDaysRouter } from './routes/game-days.ts';
import { importsRouter } from './routes/imports.ts';
import { mapRouter } from './routes/map.ts';
import { partnerRouter } from './routes/partner.ts';
import { publicRouter } from './routes/public.ts';
import { recordsRouter } from './routes/records.ts';
import { overviewRouter } from './routes/overview.ts';
import { requestsRouter } from './routes/requests.ts';
import { settingsRouter } from './routes/settings.ts';
import { costsRouter } from './routes/costs.ts';
import { budgetRouter } from './routes/budget.ts';
import { whatIfRouter } from './routes/what-if.ts';
import { compareRouter } from './routes/compare.ts';
import { sitesRouter } from './routes/sites.ts';
import { standardsRouter } from './routes/standards.ts';
import { usersRouter } from './routes/users.ts';
import { weatherRouter } from './routes/weather.ts';
import { weekPlansRouter } from './routes/week-plans.ts';
import { workOrdersRouter } from './routes/work-orders.ts';
import { workReportsRouter } from './routes/work-reports.ts';
import { mailOutboxRouter } from './routes/mail-outbox.ts';
import { DepartmentClock } from './services/clock.ts';

export const COOKIE_NAME = 'swardwise.sid';
/**
 * Behind HTTPS the cookie takes the `__Host-` prefix: browsers then keep it only when it is
 * Secure, for path / and without a Domain, so no sibling subdomain can set or shadow it.
 */
export const SECURE_COOKIE_NAME = '__Host-swardwise.sid';
/** JSON bodies: a signed-in user's edits (field outlines) may be large; nobody else's need be. */
const JSON_LIMIT_SIGNED_IN = '2mb';
const JSON_LIMIT_ANONYMOUS = '16kb';
/** How long a health check trusts the database's last answer to one (ms). */
const HEALTH_FRESH_MS = 1000;

export function createApp(
  deps: Omit<AppDeps, 'config' | 'mailer' | 'clock' | 'background' | 'authCache'> & { config: Config; mailer?: Mailer; clock?: DepartmentClock; outbox?: OutboxOptions },
): { app: Express; store: DrizzleSessionStore; background: BackgroundTasks; outbox: MailOutbox } {
  const clock = deps.clock ?? new DepartmentClock(deps.db, deps.config.departmentTimeZone);
  const background = new BackgroundTasks(deps.logger);
  // Without a mailer, e-mail is off (logged), as in a deployment with no SMTP settings.
  // Every message goes through the outbox, so an SMTP outage holds mail rather than losing it.
  const mailer = new MailOutbox(deps.db, deps.mailer ?? createMailer(null, deps.logger), deps.logger, background, deps.outbox);
  const cookieName = deps.config.cookieSecure ? SECURE_COOKIE_NAME : COOKIE_NAME;
  // Per app: two apps on one database (tests, or two processes) each keep their own.
  const authCache = new AuthCache(deps.config.authCacheMs);
  const full: AppDeps = { ...deps, mailer, clock, background, authCache, config: { ...deps.config, cookieName } };
  const { db, config, logger } = full;
  const app = express();
  const store = new DrizzleSessionStore(db, { cache: authCache, touchIntervalMs: config.sessionTouchMs });
  // The developer routes exist only beside the local mail sink, never in production.
  const devRoutes = Boolean(full.mailSink) && !config.production;

  app.disable('x-powered-by');
  // Forwarded headers (client address, protocol) only from the proxy TRUST_PROXY names.
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      // Plain-http installations on a local network must keep working; HTTPS ones set COOKIE_SECURE.
      contentSecurityPolicy: {
        directives: {
          upgradeInsecureRequests: config.cookieSecure ? [] : null,
          // Map tiles load only from the one configured tile server (none by default).
          // blob: previews of the photos a crew has chosen but not yet sent.
          imgSrc: ["'self'", 'data:', ...tileOrigins(config.mapTileUrl), 'blob:'],
          // No inline style, and no stylesheets from elsewhere: the portal's CSS is in its own
          // files, and Vue, Element Plus and Leaflet set styles through the CSSOM, which CSP allows.
          styleSrc: ["'self'"],
        },
      },
      strictTransportSecurity: config.cookieSecure,
    }),
  );
  // JSON and index.html compressed as they are sent (brotli or gzip, as the client asks); the
  // portal's assets are sent in the copies compressed at build time (http/portal.ts).
  app.use(compression());
  // A silent logger (tests, benchmarks) writes nothing, so it needs no logger per request either.
  if (logger.level !== 'silent') {
    app.use(
      pinoHttp({
        logger,
        autoLogging: { ignore: (req) => req.url === '/api/health' },
        serializers: {
          req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: loggableUrl(req.url) }),
          res: (res: { statusCode: number }) => ({ status: res.statusCode }),
        },
        customProps: (req) => ({ userId: (req as { user?: { id: number } }).user?.id }),
      }),
    );
  }
  // Before any body is read: a write from another site or port is refused here.
  app.use('/api', sameOriginWrites(config));
  app.use('/api', forgetAfterWrites(authCache));
  app.use(
    '/api',
    session({
      name: cookieName,
      secret: full.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.cookieSecure,
        maxAge: config.sessionIdleMs,
        path: '/',
      },
    }),
  );
  app.use('/api', withClock(clock));
  app.use('/api', sessionLifetime(config));
  app.use('/api', loadUser(db, authCache));
  // JSON bodies are read once the caller is known; multipart ones by the routes that take
  // them, after their ability check (http/uploads.ts).
  const jsonSignedIn = express.json({ limit: JSON_LIMIT_SIGNED_IN });
  const jsonAnonymous = express.json({ limit: JSON_LIMIT_ANONYMOUS });
  app.use('/api', (req, res, next) => (req.actor ? jsonSignedIn : jsonAnonymous)(req, res, next));
  app.use('/api', (req, _res, next) => {
    if (req.body !== undefined && nestedDeeperThan(req.body)) {
      return next(appError('request/too_deep', `The request body nests arrays or objects more than ${MAX_JSON_DEPTH} levels deep`, {
        issues: [{ path: 'body', message: `nested more than ${MAX_JSON_DEPTH} levels deep` }],
      }));
    }
    next();
  });

  // A load balancer asking many times a second needs no query each time: the database's
  // answer counts for HEALTH_FRESH_MS, after which the next check asks it again.
  let databaseAnsweredAt = Number.NEGATIVE_INFINITY;
  app.get('/api/health', async (_req, res) => {
    if (performance.now() - databaseAnsweredAt >= HEALTH_FRESH_MS) {
      await db.execute('select 1');
      databaseAnsweredAt = performance.now();
    }
    res.json({ status: 'ok' });
  });
  app.get('/api/openapi.json', serveOpenApi({ dev: devRoutes, cookieName }));
  // Public: what the sign-in page needs before anyone has signed in.
  app.get('/api/config', async (_req, res) => {
    res.json({ demo: await demoAnnouncement(db, config) });
  });
  app.use('/api/auth', authRouter(full));
  app.use('/api/public', publicRouter(full));
  app.use('/api/calendar', calendarPublicRouter(full));
  app.use('/api', requireUser);
  app.use('/api/users', usersRouter(full));
  app.use('/api/weather', weatherRouter(full));
  app.use('/api/work-orders', workOrdersRouter(full));
  app.use('/api/work-orders', workReportsRouter(full));
  app.use('/api/week-plans', weekPlansRouter(full));
  app.use('/api/records', recordsRouter(full));
  app.use('/api/overview', overviewRouter(full));
  app.use('/api/sites', sitesRouter(full));
  app.use('/api/fields', fieldsRouter(full));
  app.use('/api/fields', closuresRouter(full));
  app.use('/api/fields', stripesRouter(full));
  app.use('/api/fields', linePlansRouter(full));
  app.use('/api/fields', logosRouter(full));
  app.use('/api/field-events', fieldEventsRouter(full));
  app.use('/api/game-days', gameDaysRouter(full));
  app.use('/api/requests', requestsRouter(full));
  app.use('/api/standards', standardsRouter(full));
  app.use('/api/imports', importsRouter(full));
  app.use('/api/map', mapRouter(full));
  app.use('/api/partner', partnerRouter(full));
  app.use('/api/calendar-feeds', calendarFeedsRouter(full));
  app.use('/api/settings', settingsRouter(full));
  app.use('/api/costs', costsRouter(full));
  app.use('/api/budget', budgetRouter(full));
  app.use('/api/mail-outbox', mailOutboxRouter(full));
  app.use('/api/what-if', whatIfRouter(full));
  app.use('/api/compare', compareRouter(full));
  app.use('/api', directoryRouter(full));
  app.use('/api', crewsRouter(full));
  if (devRoutes) app.use('/api/dev', devRouter(full));
  app.use('/api', noRoute);

  if (fs.existsSync(path.join(config.portalDist, 'index.html'))) app.use(portalRouter(config.portalDist));

  app.use(errorHandler);
  return { app, store, background, outbox: mailer };
}

/** CSP source of a tile URL template: its origin, with a `{s}` subdomain as a wildcard. */
function tileOrigins(tileUrl: string | undefined): string[] {
  if (!tileUrl) return [];
  try {
    const url = new URL(tileUrl.replace(/\{s\}/g, 'tile-subdomain').replace(/\{[^}]*\}/g, '0'));
    return [url.origin.replace('tile-subdomain', '*')];
  } catch {
    return [];
  }
}
