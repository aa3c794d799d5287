/**
 * Throughput under load: 50 concurrent connections (autocannon) against a bare Express
 * "hello" route and the signed-in app on the demo city, all in the same run, so the ratio to
 * bare Express says what the app's own pipeline costs on this machine whatever else it is
 * doing. Prints requests/s, p50/p95/p97.5 latency, errors and the ratio per route, and the
 * goals of the load budget beside them. The sequential benchmarks hide queueing: every request
 * shares one embedded database connection.
 * Run: node --import tsx tests/bench/throughput.ts  (BENCH_SECONDS=5, BENCH_CONNECTIONS=50;
 * BENCH_PROFILE=<folder> writes a CPU profile of the server process there)
 */
import { fork, type ChildProcess } from 'node:child_process';
import type { Server, ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import { asc, eq } from 'drizzle-orm';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { fields } from '../../apps/api/src/db/schema/index.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { listenSignedIn, pct } from './support.ts';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const WARMUP_SECONDS = 1;

interface Figures {
  name: string;
  rps: number;
  p50: number;
  p95: number;
  p975: number;
  requests: number;
  errors: number;
  /** Processor time of the server process per answer, µs (user + system): what a request costs whatever else the machine runs. */
  cpuUs: number;
}

/** One autocannon run; latencies are kept per response so p95 is exact (autocannon reports p90 and p97.5). */
async function load(name: string, url: string, headers: Record<string, string>, seconds: number): Promise<Figures> {
  const times: number[] = [];
  // Without a callback autocannon answers a promise that is also its event emitter.
  const instance = autocannon({ url, connections: CONNECTIONS, duration: seconds, headers }) as unknown as autocannon.Instance & Promise<autocannon.Result>;
  instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => times.push(ms));
  const result = await instance;
  const errors = result.errors + result.timeouts + result.non2xx;
  return {
    name,
    rps: result.requests.total / seconds,
    p50: times.length ? pct(times, 50) : NaN,
    p95: times.length ? pct(times, 95) : NaN,
    p975: times.length ? pct(times, 97.5) : NaN,
    requests: result.requests.total,
    errors,
    cpuUs: NaN,
  };
}

/** The server process's processor time so far (µs) and the answers it has ended. */
function serverCpu(child: ChildProcess): Promise<{ cpuUs: number; answered: number }> {
  return new Promise((resolve) => {
    const onMessage = (m: { cpuUs?: number; answered?: number }) => {
      if (m.cpuUs === undefined) return;
      child.off('message', onMessage);
      resolve({ cpuUs: m.cpuUs, answered: m.answered! });
    };
    child.on('message', onMessage);
    child.send('cpu?');
  });
}

/** Waits until the server process has answered every request it took (a run's stragglers must not load the next). */
function drained(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    const onMessage = (m: { idle?: boolean }) => {
      if (!m.idle) return;
      child.off('message', onMessage);
      clearTimeout(timer);
      resolve();
    };
    child.on('message', onMessage);
    child.send('idle?');
    // Never hang the bench on a miscount: after 30 s go on regardless.
    const timer = setTimeout(() => {
      child.off('message', onMessage);
      resolve();
    }, 30_000);
  });
}

/**
 * The servers run in a child process and autocannon in this one, so the load generator does
 * not take turns on the event loop of the servers it measures.
 */
async function serve(): Promise<void> {
  let inFlight = 0;
  let answered = 0;
  let waiting = false;
  const answerIdle = () => {
    if (waiting && inFlight === 0) {
      waiting = false;
      process.send!({ idle: true });
    }
  };
  const count = (server: Server) =>
    // First in line: the bare route answers within Express's own listener, before a later one would wrap `end`.
    server.prependListener('request', (_req, res: ServerResponse) => {
      inFlight += 1;
      // Done when the handler ends its answer, not when autocannon drops the connection at
      // the end of a run: a handler still working then would load the next run.
      const end = res.end.bind(res) as (...args: unknown[]) => ServerResponse;
      let ended = false;
      res.end = ((...args: unknown[]) => {
        // Once per answer, however many layers (compression, sessions) call end again.
        if (!ended) {
          ended = true;
          inFlight -= 1;
          answered += 1;
          answerIdle();
        }
        return end(...args);
      }) as ServerResponse['end'];
    });
  process.on('message', (m) => {
    if (m === 'cpu?') {
      const { user, system } = process.cpuUsage();
      process.send!({ cpuUs: user + system, answered });
      return;
    }
    waiting = true;
    answerIdle();
  });

  const bare = express();
  bare.get('/hello', (_req, res) => {
    res.json({ hello: 'world' });
  });
  const bareServer = count(bare.listen(0, '127.0.0.1'));
  await new Promise((r) => bareServer.once('listening', r));

  const database = await openDatabase({ pgliteDir: 'memory://' });
  const { db } = database;
  await seedDemoCity(db);
  const { server, base, cookie } = await listenSignedIn(db, 'head');
  count(server);
  const [field] = await db.select({ id: fields.id }).from(fields).where(eq(fields.status, 'open')).orderBy(asc(fields.id)).limit(1);
  process.send!({ bareUrl: `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}/hello`, base, cookie, fieldId: field!.id });
}

if (process.argv.includes('--serve')) {
  // A CPU profile is written only on a normal exit, not when killed by the signal.
  if (process.execArgv.includes('--cpu-prof')) process.on('SIGTERM', () => process.exit(0));
  await serve();
} else {
  const profile = process.env.BENCH_PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE}`] : [];
  const child = fork(import.meta.filename, ['--serve'], { execArgv: ['--import', 'tsx', ...profile], stdio: 'inherit' });
  child.once('exit', (code, signal) => {
    if (code !== null || signal !== 'SIGTERM') {
      console.error(`the server process ended (${signal ?? code}) before the bench did`);
      process.exit(1);
    }
  });
  const { bareUrl, base, cookie, fieldId } = await new Promise<{ bareUrl: string; base: string; cookie: string; fieldId: number }>((resolve) => child.once('message', resolve as never));
  const signedIn = { cookie };
  const measure = async (name: string, url: string, headers: Record<string, string> = {}): Promise<Figures> => {
    await drained(child);
    await load(name, url, headers, WARMUP_SECONDS);
    await drained(child);
    const before = await serverCpu(child);
    const f = await load(name, url, headers, SECONDS);
    await drained(child);
    const after = await serverCpu(child);
    f.cpuUs = (after.cpuUs - before.cpuUs) / Math.max(1, after.answered - before.answered);
    console.log(`  ${name}: ${f.rps.toFixed(0)} req/s, server ${f.cpuUs.toFixed(0)} µs a request`);
    return f;
  };

  const rows: Figures[] = [];
  rows.push(await measure('bare Express GET /hello', bareUrl));
  const fieldsAnswer = await fetch(`${base}/api/fields`, { headers: signedIn });
  const fieldCount = ((await fieldsAnswer.json()) as { items: unknown[] }).items.length;
  rows.push(await measure(`GET /api/fields (${fieldCount} fields, cached)`, `${base}/api/fields`, signedIn));
  rows.push(await measure('GET /api/health (signed in)', `${base}/api/health`, signedIn));
  rows.push(await measure('GET /api/auth/me', `${base}/api/auth/me`, signedIn));
  rows.push(await measure(`GET /api/fields/${fieldId}/needs`, `${base}/api/fields/${fieldId}/needs`, signedIn));
  // Bare again at the end: the machine is shared, so a drift between the two says how far to trust the ratios.
  rows.push(await measure('bare Express GET /hello (again)', bareUrl));

  const bareRps = (rows[0]!.rps + rows[rows.length - 1]!.rps) / 2;
  console.log(`${CONNECTIONS} connections, ${SECONDS} s a route (after ${WARMUP_SECONDS} s warm-up); ratio = req/s ÷ bare Express req/s (mean of both bare runs); cpu µs = the server process's processor time per answer`);
  console.log(['route'.padEnd(44), 'req/s'.padStart(8), 'p50 ms'.padStart(8), 'p95 ms'.padStart(8), 'p97.5 ms'.padStart(9), 'errors'.padStart(7), 'ratio'.padStart(7), 'cpu µs'.padStart(7)].join(' '));
  for (const f of rows) {
    console.log(
      [
        f.name.padEnd(44),
        f.rps.toFixed(0).padStart(8),
        f.p50.toFixed(1).padStart(8),
        f.p95.toFixed(1).padStart(8),
        f.p975.toFixed(1).padStart(9),
        String(f.errors).padStart(7),
        `${((100 * f.rps) / bareRps).toFixed(1)} %`.padStart(7),
        f.cpuUs.toFixed(0).padStart(7),
      ].join(' '),
    );
  }
  const fieldsRow = rows[1]!;
  const needsRow = rows[4]!;
  console.log('goals (issue 16): cached signed-in reads ≥ 25 % of bare with p95 < 50 ms; a field\'s needs p95 < 150 ms; no errors');
  console.log(`  fields list: ${((100 * fieldsRow.rps) / bareRps).toFixed(1)} % of bare, p95 ${fieldsRow.p95.toFixed(1)} ms`);
  console.log(`  needs: p95 ${needsRow.p95.toFixed(1)} ms`);
  console.log(`  errors: ${rows.reduce((n, f) => n + f.errors, 0)}`);

  child.kill();
  process.exit(0);
}
