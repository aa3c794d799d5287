/**
 * A throw-away PostgreSQL server for a test run: `initdb` in a temporary folder, `pg_ctl
 * start` on a free loopback port, trust authentication for loopback only, durability off
 * (the data dies with the run). PostgreSQL refuses to run as root, so under root the
 * programs run as the `postgres` account the Debian package creates.
 */
import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { postgresBinDir } from './postgres-bin.ts';

export interface Cluster {
  /** The server's address with the superuser and no database: append `/<database>`. */
  baseUrl: string;
  dataDir: string;
  binDir: string;
  port: number;
  /** Runs one of the server's programs (pg_dump, pg_restore, psql…) as the cluster's owner. */
  run(program: string, args: string[], options?: SpawnSyncOptions): ReturnType<typeof spawnSync>;
  stop(): void;
}

export const SUPERUSER = 'swardwise';

/** A loopback port nobody listens on now. */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** uid and gid of the `postgres` account, when this process is root. */
function owner(): { uid: number; gid: number } | undefined {
  if (process.getuid?.() !== 0) return undefined;
  const line = fs.readFileSync('/etc/passwd', 'utf8').split('\n').find((l) => l.startsWith('postgres:'));
  if (!line) throw new Error('PostgreSQL will not run as root and there is no "postgres" account: apt-get install -y postgresql creates it');
  const [, , uid, gid] = line.split(':');
  return { uid: Number(uid), gid: Number(gid) };
}

export async function startCluster(): Promise<Cluster> {
  const binDir = postgresBinDir();
  if (!binDir) throw new Error('PostgreSQL server programs not found (apt-get install -y postgresql, or set PG_BIN)');
  const user = owner();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-pg-'));
  if (user) fs.chownSync(dataDir, user.uid, user.gid);
  const run: Cluster['run'] = (program, args, options = {}) =>
    spawnSync(path.join(binDir, program), args, { encoding: 'utf8', cwd: dataDir, ...user, ...options });
  const must = (program: string, args: string[]) => {
    const res = run(program, args);
    if (res.status !== 0) throw new Error(`${program} failed (${res.status}): ${String(res.stderr)}${String(res.stdout)}`);
  };
  const pgdata = path.join(dataDir, 'data');
  must('initdb', ['-D', pgdata, '-U', SUPERUSER, '-A', 'trust', '-E', 'UTF8', '--locale=C', '--no-sync', '--no-instructions']);
  const port = await freePort();
  const settings = [
    `-p ${port}`,
    '-c listen_addresses=127.0.0.1',
    `-c unix_socket_directories=${dataDir}`,
    '-c fsync=off',
    '-c synchronous_commit=off',
    '-c full_page_writes=off',
    '-c max_connections=300',
  ].join(' ');
  must('pg_ctl', ['-D', pgdata, '-l', path.join(dataDir, 'server.log'), '-w', '-t', '60', '-o', settings, 'start']);
  let stopped = false;
  return {
    baseUrl: `postgres://${SUPERUSER}@127.0.0.1:${port}`,
    dataDir,
    binDir,
    port,
    run,
    stop() {
      if (stopped) return;
      stopped = true;
      run('pg_ctl', ['-D', pgdata, '-m', 'immediate', '-w', 'stop']);
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
