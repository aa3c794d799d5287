/** A fresh API on its own in-memory PGlite, for one test file. */
import { pino } from 'pino';
import supertest from 'supertest';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { startMailSink, type MailSink } from '../../apps/api/src/mail/sink.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { buildFixture, PASSWORD, type Fixture } from './fixture.ts';

export interface TestApi {
  database: Database;
  app: ReturnType<typeof createApp>['app'];
  fixture: Fixture;
  /** The SMTP sink this API sends its e-mail to. */
  mail: MailSink;
  /** The department clock the API reads "today" from. */
  clock: DepartmentClock;
  /** A cookie-keeping client signed in as the fixture user. */
  signIn(user: keyof Fixture['users']): Promise<ReturnType<typeof supertest.agent>>;
  /** The same for any account with the fixture password (see `addUser`). */
  signInAs(email: string): Promise<ReturnType<typeof supertest.agent>>;
  close(): Promise<void>;
}

/** `now`: the server's clock (by default the real one), for tests that stand at a chosen instant. */
export async function startTestApi(env: Record<string, string> = {}, options: { now?: () => Date } = {}): Promise<TestApi> {
  const database = await openDatabase({ pgliteDir: 'memory://' });
  const fixture = await buildFixture(database.db);
  const config = loadConfig({ NODE_ENV: 'test', PUBLIC_URL: 'http://portal.test', ...env });
  const logger = pino({ level: 'silent' });
  const mail = await startMailSink();
  const mailer = createMailer({ host: '127.0.0.1', port: mail.port, secure: false, ignoreTLS: true, from: config.mailFrom }, logger);
  const clock = new DepartmentClock(database.db, config.departmentTimeZone, options.now);
  const { app } = createApp({ db: database.db, config, logger, sessionSecret: 'test-secret', mailer, mailSink: mail, clock });
  async function signInAs(email: string) {
    const agent = supertest.agent(app);
    const res = await agent.post('/api/auth/sign-in').send({ email, password: PASSWORD });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return agent;
  }
  return {
    database,
    app,
    fixture,
    mail,
    clock,
    signIn: (key) => signInAs(fixture.users[key].email),
    signInAs,
    close: async () => {
      await mail.close();
      await database.close();
    },
  };
}
