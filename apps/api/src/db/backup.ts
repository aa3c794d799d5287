/**
 * Backup and restore of the embedded database (PGlite's data folder). PostgreSQL servers are
 * backed up with pg_dump / pg_restore instead (README, "Backups").
 *
 *   node --import tsx apps/api/src/db/backup.ts dump  <file.tar.gz>   the folder of PGLITE_DIR, into one file
 *   node --import tsx apps/api/src/db/backup.ts restore <file.tar.gz> into PGLITE_DIR, which must not exist yet
 *
 * Stop the server first: PGlite has no lock between processes, so a second process reading
 * the folder of a running server may see a half-written page.
 */
import fs from 'node:fs';
import { PGlite } from '@electric-sql/pglite';

/** The whole data folder as one gzipped tar (PGlite `dumpDataDir`). */
export async function dumpPglite(dir: string): Promise<Buffer> {
  if (!fs.existsSync(dir)) throw new Error(`There is no PGlite data folder at ${dir}`);
  const client = await PGlite.create(dir);
  try {
    const dump = await client.dumpDataDir('gzip');
    return Buffer.from(await dump.arrayBuffer());
  } finally {
    await client.close();
  }
}

/** A new data folder from a dump; refuses to write over a folder that holds anything. */
export async function restorePglite(dump: Buffer, dir: string): Promise<void> {
  if (fs.existsSync(dir) && fs.readdirSync(dir).length > 0) throw new Error(`${dir} is not empty; restore into a new folder, then point PGLITE_DIR at it`);
  fs.mkdirSync(dir, { recursive: true });
  const client = await PGlite.create({ dataDir: dir, loadDataDir: new Blob([new Uint8Array(dump)]) });
  await client.close();
}

async function main(argv: string[]) {
  const [command, file] = argv;
  const dir = process.env.PGLITE_DIR || './data/pglite';
  if (command === 'dump' && file) {
    const dump = await dumpPglite(dir);
    fs.writeFileSync(file, dump);
    process.stdout.write(`Dumped ${dir} to ${file} (${dump.length} bytes)\n`);
  } else if (command === 'restore' && file) {
    await restorePglite(fs.readFileSync(file), dir);
    process.stdout.write(`Restored ${file} into ${dir}\n`);
  } else {
    console.error('usage: backup.ts dump <file.tar.gz> | restore <file.tar.gz>   (the folder is PGLITE_DIR, default ./data/pglite)');
    process.exit(2);
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main(process.argv.slice(2)).catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
