/**
 * drizzle-kit generates SQL migrations from the schema (`npm run db:generate`). The server
 * applies them itself at start-up; never run `drizzle-kit migrate` against a running
 * server's PGlite folder (PGlite has no lock between processes).
 */
import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  driver: 'pglite',
  schema: './apps/api/src/db/schema/index.ts',
  out: './apps/api/src/db/migrations',
  dbCredentials: { url: './data/drizzle-kit' },
  strict: true,
  verbose: true,
});
