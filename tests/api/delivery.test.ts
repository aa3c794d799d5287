/**
 * How the server sends things over a slow connection: API answers compressed (brotli or
 * gzip, as the client asks), the portal's hashed assets in their build-time brotli or gzip
 * copies and cached for a year, index.html and the service worker asked again each time.
 * The portal here is a small stand-in folder laid out as `vite build` lays it out.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import supertest from 'supertest';
import { afterAll, describe, expect, test } from 'vitest';
import { useTestApi } from '../support/app.ts';

const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-dist-'));
const SCRIPT = `export const rows = ${JSON.stringify(Array.from({ length: 200 }, (_, i) => ({ id: i, name: `Field ${i}` })))};\n`;
fs.mkdirSync(path.join(dist, 'assets'));
fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><html><head><script type="module" src="/assets/index-Ab12Cd34.js"></script></head><body><div id="app"></div></body></html>');
// Today's own copy of index.html, naming its files too (apps/portal/build/todayChunks.ts).
fs.writeFileSync(path.join(dist, 'today.html'), '<!doctype html><html><head><link rel="modulepreload" href="/assets/today-Ef56Gh78.js"></head><body><div id="app"></div></body></html>');
fs.writeFileSync(path.join(dist, 'sw.js'), 'self.addEventListener("fetch", () => {});');
fs.writeFileSync(path.join(dist, 'assets/index-Ab12Cd34.js'), SCRIPT);
fs.writeFileSync(path.join(dist, 'assets/index-Ab12Cd34.js.br'), zlib.brotliCompressSync(SCRIPT));
fs.writeFileSync(path.join(dist, 'assets/index-Ab12Cd34.js.gz'), zlib.gzipSync(SCRIPT));
afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

const api = useTestApi({ PORTAL_DIST: dist });

describe('API answers', () => {
  test('should be brotli-compressed when the client accepts brotli, and gzip when only gzip', async () => {
    const agent = await api.signIn('foreman');
    const br = await agent.get('/api/fields').set('Accept-Encoding', 'gzip, deflate, br').buffer(true);
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['vary']).toMatch(/Accept-Encoding/i);
    const fields = JSON.parse(br.text) as { items: unknown[] };
    expect(fields.items.length).toBeGreaterThan(0);

    const gz = await agent.get('/api/fields').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.body).toEqual(fields);
  });

  test('should be sent as they are to a client that accepts no encoding', async () => {
    const res = await supertest(api.app).get('/api/openapi.json').set('Accept-Encoding', 'identity');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
  });
});

describe('the built portal', () => {
  test('should send a hashed asset in its build-time brotli copy, cached for a year', async () => {
    const res = await supertest(api.app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip, deflate, br').buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.text).toBe(SCRIPT);
  });

  test('should send the gzip copy to a gzip-only client and the file itself to one with no encoding', async () => {
    const gz = await supertest(api.app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip').buffer(true);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(SCRIPT);
    const plain = await supertest(api.app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'identity').buffer(true);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(SCRIPT);
    expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  test('should answer an asset of another build with a 404, not with index.html', async () => {
    const res = await supertest(api.app).get('/assets/index-Zz99Yy88.js');
    expect(res.status).toBe(404);
    expect(res.text).not.toMatch(/<html/);
  });

  test('should have index.html, for every page of the app, and the service worker asked again each time', async () => {
    for (const url of ['/', '/today', '/index.html', '/fields/12']) {
      const res = await supertest(api.app).get(url);
      expect(res.status, url).toBe(200);
      expect(res.text, url).toMatch(/<div id="app">/);
      expect(res.headers['cache-control'], url).toBe('no-cache');
    }
    // Today's page names its own files; every other page, and a deeper path, gets index.html.
    expect((await supertest(api.app).get('/today')).text).toMatch(/today-Ef56Gh78\.js/);
    for (const url of ['/', '/fields/12', '/today/x', '/sign-in']) expect((await supertest(api.app).get(url)).text, url).not.toMatch(/today-Ef56Gh78/);
    const sw = await supertest(api.app).get('/sw.js');
    expect(sw.headers['cache-control']).toBe('no-cache');
    expect(sw.headers['content-type']).toMatch(/javascript/);
  });
});
