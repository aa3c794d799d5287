/**
 * The vitest projects of the whole repository. `npm test` runs them all; pick one with
 * `npx vitest run --project <name>`.
 */
import { configDefaults, defineConfig, type TestProjectInlineConfiguration } from 'vitest/config';
import { postgresBinDir } from './tests/support/postgres-bin.ts';

const ci = Boolean(process.env.CI) && process.env.CI !== 'false' && process.env.CI !== '0';
const postgres = postgresBinDir();
if (!postgres && ci) throw new Error('CI: PostgreSQL server programs not found; .ci/run installs them (apt-get install -y postgresql)');
if (!postgres) console.warn('PostgreSQL server programs not found: the api-pg project (API tests on PostgreSQL) is left out. apt-get install -y postgresql, or set PG_BIN.');

/** The API black-box tests; `api` runs them on in-memory PGlite, `api-pg` on a PostgreSQL server. */
const apiTests = (name: 'api' | 'api-pg', globalSetup: string[], groupOrder: number): TestProjectInlineConfiguration => ({
  test: {
    name,
    root: './tests',
    include: ['api/**/*.test.ts'],
    // Start-up and crash tests of the embedded data folder start PGlite servers whatever the
    // project: on PostgreSQL they would only repeat themselves.
    exclude: [...configDefaults.exclude, ...(name === 'api-pg' ? ['api/kill-nine.test.ts', 'api/data-folder.test.ts'] : [])],
    // Fuzzing proves the checks before the database at full count on PGlite (over 10,000
    // bodies); on PostgreSQL a quarter of them shows the same refusals leave its tables unchanged.
    env: name === 'api-pg' ? { FUZZ_PER_ROUTE: '50' } : {},
    environment: 'node',
    // Files of one worker share the module graph: each file loaded the Express app and its
    // imports again in a fresh isolate (about 3.7 s a file). The app keeps no state outside
    // what a file's own database and app objects hold (caches are keyed by database or app),
    // and each file closes what it opens (support/app.ts).
    isolate: false,
    // Server logs of every API test go to one folder, scanned for secrets after the run.
    globalSetup: ['./support/log-scan.ts', ...globalSetup],
    // Each file opens its own database (a few seconds on PGlite); keep the two cores busy
    // without running more databases than there are cores.
    maxWorkers: 2,
    // Projects with their own worker limits run in their own group, after the fast ones, and
    // the two API projects one after the other (two workers each would overload two cores).
    sequence: { groupOrder },
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'domain',
          root: './packages/domain',
          // Pure functions without module state: the files of a worker share its imports.
          isolate: false,
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'reference',
          root: './tests',
          isolate: false,
          include: ['reference/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api-unit',
          root: './apps/api',
          isolate: false,
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      apiTests('api', ['./support/db-snapshot.ts'], 1),
      // A throw-away PostgreSQL server (support/postgres-setup.ts) with template databases.
      ...(postgres ? [apiTests('api-pg', ['./support/postgres-setup.ts'], 2)] : []),
      {
        extends: './apps/portal/vite.config.ts',
        test: {
          name: 'portal',
          root: './apps/portal',
          include: ['src/**/*.test.ts'],
          environment: 'happy-dom',
          // Mounting Element Plus components takes seconds when the browser tests share the cores.
          testTimeout: 20_000,
          server: { deps: { inline: ['@vue-leaflet/vue-leaflet', 'element-plus'] } },
        },
      },
      {
        test: {
          name: 'e2e',
          root: './tests',
          include: ['e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['./e2e/global-setup.ts'],
          fileParallelism: false,
          // One file at a time, so each file's imports (playwright-core, axe-core's source, the
          // API for own-server files) were loaded again on the run's critical path: about 2.5 s
          // a file. Each file closes the pages and servers it opens (useBrowser, own-server.ts).
          isolate: false,
          sequence: { groupOrder: 3 },
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
