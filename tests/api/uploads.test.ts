/**
 * Multipart routes (station files, imports, work photos): the caller is checked before the
 * body is read, and every part of the body is bounded.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { PASSWORD, giveWork } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
let server: http.Server;
let port: number;
let southOrder: number;
let northOrder: number;

beforeAll(async () => {
  api = await startTestApi();
  server = api.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  port = (server.address() as AddressInfo).port;
  southOrder = await giveWork(api.database.db, api.fixture.fields.southBaseball, api.fixture.crews.south);
  northOrder = await giveWork(api.database.db, api.fixture.fields.northSoccer, api.fixture.crews.north);
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await api.close();
});

async function cookieOf(user: 'partner' | 'crew' | 'foreman'): Promise<string> {
  const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: api.fixture.users[user].email, password: PASSWORD });
  expect(res.status).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0]!;
}

const BOUNDARY = 'swardwise-test-boundary';
const MB = 1024 * 1024;

interface EarlyAnswer {
  status: number;
  connection: string | undefined;
  body: string;
  /** Bytes of the body the client had written when the answer arrived. */
  sentWhenAnswered: number;
  /** Resolves when the server has closed the connection (it does not read the rest). */
  closed: Promise<void>;
}

/**
 * Starts a multipart POST announcing `declaredBytes` of body, writes only its first 64 kB
 * and waits for the answer: an answer here came before the server read the body.
 */
function startLargeUpload(path: string, cookie: string, declaredBytes: number): Promise<EarlyAnswer> {
  return new Promise((resolve, reject) => {
    const req = http.request({
      host: '127.0.0.1',
      port,
      path,
      method: 'POST',
      headers: { cookie, 'content-type': `multipart/form-data; boundary=${BOUNDARY}`, 'content-length': String(declaredBytes) },
    });
    const closed = new Promise<void>((r) => req.once('close', () => r()));
    // Writing into a connection the server has closed fails; that is the point.
    req.on('error', () => undefined);
    const head = Buffer.from(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`);
    const first = Buffer.concat([head, Buffer.alloc(64 * 1024 - head.length, 'a')]);
    req.write(first);
    req.on('response', (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (d) => (body += d));
      res.on('end', () => resolve({ status: res.statusCode!, connection: res.headers.connection, body, sentWhenAnswered: first.length, closed }));
      res.on('error', reject);
    });
  });
}

/** A multipart body with the given text fields and one small file. */
function post(agent: ReturnType<typeof supertest.agent>, path: string, fileField: string, fileName: string, fields: Record<string, string>) {
  let req = agent.post(path);
  for (const [name, value] of Object.entries(fields)) req = req.field(name, value);
  return req.attach(fileField, Buffer.from('date,tmax_c\n'), fileName);
}

describe('a caller who may not upload', () => {
  test('should get 403 for a partner’s 50 MB station file before the body is read, and the connection closed', async () => {
    const answer = await startLargeUpload('/api/weather/stations/1/csv', await cookieOf('partner'), 50 * MB);
    expect(answer.status).toBe(403);
    expect(JSON.parse(answer.body).error.code).toBe('auth/forbidden');
    expect(answer.sentWhenAnswered).toBeLessThan(MB);
    expect(answer.connection).toBe('close');
    await answer.closed;
  });

  test('should get 403 for a partner’s 50 MB import and a crew’s 50 MB photo on another crew’s order, before the body is read', async () => {
    const importAnswer = await startLargeUpload('/api/imports', await cookieOf('partner'), 50 * MB);
    expect(importAnswer.status).toBe(403);
    expect(importAnswer.connection).toBe('close');
    await importAnswer.closed;
    const photoAnswer = await startLargeUpload(`/api/work-orders/${southOrder}/photos`, await cookieOf('crew'), 50 * MB);
    expect(photoAnswer.status).toBe(403);
    expect(photoAnswer.connection).toBe('close');
    await photoAnswer.closed;
  });

  test('should get 401 without a session before the body is read', async () => {
    const answer = await startLargeUpload('/api/imports', 'swardwise.sid=none', 50 * MB);
    expect(answer.status).toBe(401);
    expect(answer.connection).toBe('close');
    await answer.closed;
  });
});

describe('limits of a caller who may upload', () => {
  test('should refuse a body declared larger than the route takes with 413 before reading it', async () => {
    const answer = await startLargeUpload('/api/weather/stations/1/csv', await cookieOf('foreman'), 50 * MB);
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error.code).toBe('weather/too_large');
    expect(answer.connection).toBe('close');
    await answer.closed;
  });

  test('should refuse too many parts with 413 on every multipart route', async () => {
    const foreman = await api.signIn('foreman');
    const crew = await api.signIn('crew');
    const extra = Object.fromEntries(Array.from({ length: 6 }, (_, i) => [`extra${i}`, 'x']));
    const csv = await post(foreman, '/api/weather/stations/1/csv', 'file', 'w.csv', { note: 'x' });
    expect(csv.status).toBe(413);
    expect(csv.body.error.code).toBe('weather/too_large');
    const imported = await post(foreman, '/api/imports', 'file', 'sites.csv', { kind: 'sites_csv', ...extra });
    expect(imported.status).toBe(413);
    expect(imported.body.error.code).toBe('import/too_large');
    const photo = await post(crew, `/api/work-orders/${northOrder}/photos`, 'photo', 'p.jpg', { clientRef: 'ref-12345678', ...extra });
    expect(photo.status).toBe(413);
    expect(photo.body.error.code).toBe('work_photo/too_large');
  });

  test('should refuse a second file with 413', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/imports').field('kind', 'sites_csv').attach('file', Buffer.from('a\n'), 'a.csv').attach('file', Buffer.from('b\n'), 'b.csv');
    expect(res.status).toBe(413);
  });

  test('should refuse a too-large text field with 413', async () => {
    const foreman = await api.signIn('foreman');
    const crew = await api.signIn('crew');
    const imported = await post(foreman, '/api/imports', 'file', 'sites.csv', { kind: 'k'.repeat(100_000) });
    expect(imported.status).toBe(413);
    expect(imported.body.error.message).toMatch(/form field is too long/);
    const photo = await post(crew, `/api/work-orders/${northOrder}/photos`, 'photo', 'p.jpg', { clientRef: 'r'.repeat(100_000) });
    expect(photo.status).toBe(413);
  });
});
