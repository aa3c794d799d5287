/**
 * What the application hands each router: its own module so that routes need not import
 * `app.ts`, which imports them.
 */
import type { Logger } from 'pino';
import type { Config } from './config.ts';
import type { AuthCache } from './http/auth-cache.ts';
import type { Db } from './db/client.ts';
import type { Mailer } from './mail/mailer.ts';
import type { MailSink } from './mail/sink.ts';
import type { BackgroundTasks } from './services/background.ts';
import type { DepartmentClock } from './services/clock.ts';

export interface AppDeps {
  db: Db;
  config: Config & { cookieName: string };
  logger: Logger;
  sessionSecret: string;
  mailer: Mailer;
  /** The local SMTP sink, when this process runs one (development and tests only). */
  mailSink?: MailSink | undefined;
  /** The department clock (its time zone a setting); tests pass one standing at a chosen instant. */
  clock: DepartmentClock;
  /** Work finished after the answer (password-reset look-ups and e-mail). */
  background: BackgroundTasks;
  /**
   * Prefix of this app's sign-in and reset counters in the database. Apps over one database
   * with the same prefix (the default, '') count together, as API processes must; tests give
   * an app with other limits its own.
   */
  rateLimitPrefix?: string;
  /** Sessions and users this process read in the last AUTH_CACHE_SECONDS (`http/auth-cache.ts`). */
  authCache: AuthCache;
}
