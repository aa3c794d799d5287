/**
 * Hostile uploads on every photo route (work orders, field checks, requests): an over-size
 * file, a page or a script disguised by its name and type, a hostile SVG, a decompression bomb
 * and a broken image are refused with a 4xx that says why, and leave nothing on disk; file
 * names with path tricks never choose where a photo is stored.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { fieldRequests } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { giveWork } from '../support/fixture.ts';
import { CHECK } from '../support/route-matrix.ts';

const root = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-hostile-uploads-'));
const uploads = path.join(root, 'uploads');
fs.mkdirSync(uploads);
const api = useTestApi({ UPLOADS_DIR: uploads });
afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

/** Every file under the temporary root, so a file written beside the uploads folder shows too. */
function filesOnDisk(dir = root): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? filesOnDisk(path.join(dir, e.name)) : [path.join(dir, e.name)]));
}

let routes: { name: string; url: string }[];

beforeAll(async () => {
  const f = api.fixture;
  const admin = await api.signIn('admin');
  const order = await giveWork(api.database.db, f.fields.northSoccer, f.crews.north, 0);
  const check = await admin.post(`/api/fields/${f.fields.northSoccer}/checks`).send(CHECK);
  const [request] = await api.database.db
    .insert(fieldRequests)
    .values({ fieldId: f.fields.northSoccer, siteId: f.sites.northPark, districtId: f.districts.north, kind: 'wet_area', description: 'Puddles', createdBy: f.users.admin.id })
    .returning({ id: fieldRequests.id });
  routes = [
    { name: 'work order photo', url: `/api/work-orders/${order}/photos` },
    { name: 'field check photo', url: `/api/fields/${f.fields.northSoccer}/checks/${check.body.check?.id ?? check.body.id}/photos` },
    { name: 'request photo', url: `/api/requests/${request!.id}/photos` },
  ];
}, 60_000);

const HOSTILE_SVG = Buffer.from(
  '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><script>alert(document.cookie)</script><image href="file:///etc/passwd"/><text>&x;</text></svg>',
);

async function hostileFiles() {
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#3a7' } }).png().toBuffer();
  // 100 megapixels of one colour: a few hundred kB on the wire, 300 MB once decoded.
  const bomb = await sharp({ create: { width: 10_000, height: 10_000, channels: 3, background: '#000' } })
    .greyscale()
    .png({ compressionLevel: 9 })
    .toBuffer();
  return [
    { what: 'over 12 MB', data: Buffer.concat([png, Buffer.alloc(12 * 1024 * 1024 + 10)]), filename: 'big.png', type: 'image/png', status: [413] },
    { what: 'a web page named as a photo', data: Buffer.from('<html><script>alert(1)</script></html>'), filename: 'field.jpg', type: 'image/jpeg', status: [415] },
    { what: 'a script named as a photo', data: Buffer.from('#!/bin/sh\nrm -rf /\n'), filename: 'photo.png', type: 'image/png', status: [415] },
    { what: 'a hostile SVG named as a PNG', data: HOSTILE_SVG, filename: 'logo.png', type: 'image/png', status: [415] },
    { what: 'a hostile SVG as itself', data: HOSTILE_SVG, filename: 'logo.svg', type: 'image/svg+xml', status: [415] },
    { what: 'a decompression bomb', data: bomb, filename: 'bomb.png', type: 'image/png', status: [413, 415, 422] },
    { what: 'a cut-off PNG', data: png.subarray(0, png.length - 20), filename: 'cut.png', type: 'image/png', status: [415, 422] },
    { what: 'an empty file', data: Buffer.alloc(0), filename: 'empty.jpg', type: 'image/jpeg', status: [400, 415] },
  ];
}

describe('hostile uploads', () => {
  test('should refuse each hostile file on every photo route with a 4xx that says why, and leave nothing on disk', async () => {
    const admin = await api.signIn('admin');
    const files = await hostileFiles();
    const before = filesOnDisk();
    const wrong: string[] = [];
    for (const route of routes) {
      for (const file of files) {
        const res = await admin.post(route.url).attach('photo', file.data, { filename: file.filename, contentType: file.type });
        const message = res.body?.error?.message as string | undefined;
        if (!file.status.includes(res.status) || !message) wrong.push(`${route.name}, ${file.what}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(filesOnDisk()).toEqual(before);
  }, 120_000);

  test('should store a photo under a name of its own whatever the file name says, inside the uploads folder, or refuse it', async () => {
    const admin = await api.signIn('admin');
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#3a7' } }).png().toBuffer();
    const tricks = ['../../escape.png', '..\\..\\escape.png', '/etc/cron.d/escape.png', 'escape.png\u0000.jpg', '%2e%2e%2fescape.png'];
    for (const [i, filename] of tricks.entries()) {
      const route = routes[i % routes.length]!;
      const res = await admin.post(route.url).attach('photo', png, { filename, contentType: 'image/png' });
      // Taken under a name of its own, or refused with a reason (a NUL in the name ends the part's headers).
      expect([201, 400], `${route.name} ${JSON.stringify(filename)}: ${res.status}`).toContain(res.status);
      if (res.status === 400) expect(res.body.error.message).toMatch(/\w{5}/);
    }
    const stored = filesOnDisk();
    expect(stored.length).toBeGreaterThan(0);
    for (const file of stored) {
      expect(path.dirname(file).startsWith(uploads)).toBe(true);
      expect(path.basename(file)).not.toMatch(/escape|\.\.|cron/);
    }
    // A client reference with path tricks is refused before anything is stored.
    const trick = await admin.post(routes[0]!.url).field('clientRef', '../../../escape').attach('photo', png, { filename: 'a.png', contentType: 'image/png' });
    expect(trick.status).toBe(400);
    expect(filesOnDisk()).toEqual(stored);
  }, 120_000);
});
