/**
 * The vitest projects of the whole repository. `npm test` runs them all; pick one with
 * `npx vitest run --project <name>`.
 */
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'domain',
          root: './packages/domain',
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'reference',
          root: './tests',
          include: ['reference/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api-unit',
          root: './apps/api',
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          root: './tests',
          include: ['api/**/*.test.ts'],
          environment: 'node',
          // Server logs of every API test go to one folder, scanned for secrets after the run.
          globalSetup: ['./support/log-scan.ts', './support/db-snapshot.ts'],
          // Each file opens its own PGlite database (a few seconds); keep the two cores busy
          // without running more databases than there are cores.
          maxWorkers: 2,
          // Projects with their own worker limits run in their own group, after the fast ones.
          sequence: { groupOrder: 1 },
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: './apps/portal/vite.config.ts',
        test: {
          name: 'portal',
          root: './apps/portal',
          include: ['src/**/*.test.ts'],
          environment: 'happy-dom',
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
          sequence: { groupOrder: 2 },
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
