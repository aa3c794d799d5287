/**
 * Starts Swardwise: opens the database, applies migrations, seeds the demo city in demo
 * mode (`--demo`, DEMO=true) or makes sure a new installation has its first administrator,
 * serves. A start that cannot go on safely says why and exits with status 1.
 */
import { pino } from 'pino';
import { createApp } from './app.ts';
import { loadConfig } from './config.ts';
import { openDatabase } from './db/client.ts';
import { vacuumChurningTables } from './db/maintenance.ts';
import { DrizzleRateLimitStore } from './http/rate-limit-store.ts';
import { createMailer, type SmtpSettings } from './mail/mailer.ts';
import { startMailSink, type MailSink } from './mail/sink.ts';
import { DepartmentClock } from './services/clock.ts';
import { prepareInstallation, StartupError } from './services/first-run.ts';
import { sessionSecretFor } from './services/settings.ts';

async function main() {
  const config = loadConfig(process.env, process.argv.slice(2));
  const logger = pino({ level: config.logLevel });
  const started = Date.now();
  const database = await openDatabase({ databaseUrl: config.databaseUrl, pgliteDir: config.pgliteDir });
  logger.info({ kind: database.kind, dir: database.kind === 'pglite' ? config.pgliteDir : undefined, ms: Date.now() - started }, 'database ready');
  // A stored time zone this runtime does not know stops the start here, with the reason.
  const clock = new DepartmentClock(database.db, config.departmentTimeZone);
  try {
    await clock.ready();
    logger.info({ timeZone: clock.timeZone, today: clock.today() }, 'department clock');
    await prepareInstallation(database.db, config, logger, undefined, clock.today(), clock.timeZone);
  } catch (err) {
    await database.close();
    throw err;
  }
  if (config.production && !config.demo && !config.publicUrlSet) {
    logger.warn({ publicUrl: config.publicUrl }, 'PUBLIC_URL is not set: links in e-mails point at this default, and writes are accepted from the address each browser used');
  }
  const sessionSecret = await sessionSecretFor(database.db, config.sessionSecret);

  let mailSink: MailSink | undefined;
  let smtp: SmtpSettings | null = config.smtp ? { ...config.smtp, from: config.mailFrom } : null;
  if (!smtp && config.mailSink && !config.production) {
    // Another process may hold the usual port (a second dev server); any free port will do.
    mailSink = await startMailSink({ port: config.mailSinkPort }).catch(() => startMailSink({ port: 0 }));
    smtp = { host: '127.0.0.1', port: mailSink.port, secure: false, from: config.mailFrom, ignoreTLS: true };
    logger.info({ port: mailSink.port }, 'development mail sink listening; messages at /api/dev/mail');
  }
  const mailer = createMailer(smtp, logger);
  const { app, store, background, outbox } = createApp({ db: database.db, config, logger, sessionSecret, mailer, mailSink, clock });
  // Mail left from before a restart or waiting out an SMTP outage goes when it is due.
  outbox.start(config.mailRetryIntervalMs);
  void outbox.flush().catch((err: unknown) => logger.warn({ err }, 'mail outbox pass failed'));
  const server = app.listen(config.port, config.host, () => {
    logger.info({ url: `http://localhost:${config.port}`, production: config.production, demo: config.demo }, config.demo ? 'Swardwise is listening (demo mode)' : 'Swardwise is listening');
  });
  // Once an hour: expired sessions and rate-limit windows go, then the embedded database
  // reclaims the row versions its busiest tables left behind (a PostgreSQL server's autovacuum
  // does that there). The first pass runs a minute after start, so a long-running installation
  // that was stopped and started does not wait an hour.
  const upkeep = async () => {
    await store.prune().catch((err: unknown) => logger.warn({ err }, 'session prune failed'));
    await DrizzleRateLimitStore.prune(database.db).catch((err: unknown) => logger.warn({ err }, 'rate limit prune failed'));
    await vacuumChurningTables(database).catch((err: unknown) => logger.warn({ err }, 'vacuum of the busiest tables failed'));
  };
  const prune = setInterval(() => void upkeep(), 3600_000);
  prune.unref();
  setTimeout(() => void upkeep(), 60_000).unref();

  const stop = (signal: string) => {
    logger.info({ signal }, 'shutting down');
    outbox.stop();
    server.close(() => {
      void background
        .idle()
        .then(() => Promise.allSettled([database.close(), mailSink?.close()]))
        .finally(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err) => {
  // A refused start is a message for whoever deploys, not a stack trace.
  console.error(err instanceof StartupError ? `Swardwise cannot start: ${err.message}` : err);
  process.exit(1);
});
