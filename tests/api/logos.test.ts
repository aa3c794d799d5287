import fs from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { auditLog, fieldLogos } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { useTempDir } from '../support/temp-dir.ts';
import { giveWork } from '../support/fixture.ts';
import { getPdf, renderPdf } from '../support/pdf.ts';

const uploads = useTempDir('sw-logos-');
const api = useTestApi({ UPLOADS_DIR: uploads });
const db = () => api.database.db;

/** Left half red, right half white with a blue disc of radius 40 (a quarter of the picture is blue: π·40² ÷ 20,000 = 0.2513). */
const LOGO_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="100" viewBox="0 0 200 100">
  <rect x="0" y="0" width="100" height="100" fill="#c81010"/>
  <rect x="100" y="0" width="100" height="100" fill="#ffffff"/>
  <circle cx="150" cy="50" r="40" fill="#1030c0"/>
</svg>`;

const svgFile = () => ({ filename: 'logo.svg', contentType: 'image/svg+xml' });
type Agent = Awaited<ReturnType<typeof api.signIn>>;
const upload = (agent: Agent, fieldId: number, text: string | Buffer, name = 'Club crest') =>
  agent.post(`/api/fields/${fieldId}/logos`).field('name', name).attach('logo', Buffer.isBuffer(text) ? text : Buffer.from(text), Buffer.isBuffer(text) ? { filename: 'logo.png', contentType: 'image/png' } : svgFile());

const storedText = async (id: number) => {
  const [row] = await db().select().from(fieldLogos).where(eq(fieldLogos.id, id));
  return fs.readFileSync(path.join(uploads, row!.fileName), 'utf8');
};

describe('field logos', () => {
  test('should let a foreman upload, place, turn and remove a logo, with paint per colour and a set-out sheet', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const res = await upload(foreman, id, LOGO_SVG);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const logo = res.body.logo;
    expect(logo).toMatchObject({ name: 'Club crest', mime: 'image/svg+xml', rotationDeg: 0, gridSpacingM: 1, version: 1 });
    expect(logo.pixelWidth / logo.pixelHeight).toBeCloseTo(2, 2);
    expect(logo.heightM).toBeCloseTo(logo.widthM / 2, 6);
    const share = (hex: string) => logo.colours.find((c: { hex: string }) => c.hex === hex)?.share ?? 0;
    expect(share('#c81010')).toBeCloseTo(0.5, 2);
    expect(share('#1030c0')).toBeCloseTo(0.2513, 1);
    expect(logo.colours.reduce((s: number, c: { share: number }) => s + c.share, 0)).toBeCloseTo(1, 6);
    // Paint per colour adds up to the total, with a white base under the red and the blue.
    type Row = { kind: string; hex: string; areaM2: number; mixedLitres: number; dark: boolean };
    const rows = logo.paint.rows as Row[];
    expect(rows.reduce((s, r) => s + r.mixedLitres, 0)).toBeCloseTo(logo.paint.total.mixedLitres, 9);
    const base = rows.find((r) => r.kind === 'base')!;
    expect(base.areaM2).toBeCloseTo(logo.paint.logoAreaM2 * (share('#c81010') + share('#1030c0')), 6);
    expect(rows.filter((r) => r.dark).map((r) => r.hex).sort()).toEqual(['#1030c0', '#c81010']);

    const moved = await foreman.patch(`/api/fields/${id}/logos/${logo.id}`).send({ centerXM: 30, centerYM: 20, widthM: 8, rotationDeg: 30, gridSpacingM: 0.5, version: 1 });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect(moved.body.logo).toMatchObject({ centerXM: 30, centerYM: 20, widthM: 8, rotationDeg: 30, gridSpacingM: 0.5, version: 2, insideField: true });
    expect(moved.body.logo.grid.columns).toBe(Math.ceil((8 * Math.cos(Math.PI / 6) + 4 * Math.sin(Math.PI / 6)) / 0.5));
    expect((await foreman.patch(`/api/fields/${id}/logos/${logo.id}`).send({ rotationDeg: 10, version: 1 })).body.error.code).toBe('field_logo/version_conflict');

    const list = await foreman.get(`/api/fields/${id}/logos`);
    expect(list.status).toBe(200);
    expect(list.body.logos.logos).toHaveLength(1);
    expect(list.body.logos.caution).toMatch(/Dark pigments/);
    expect(list.body.logos.lengthM).toBeGreaterThan(90);

    const image = await foreman.get(`/api/fields/${id}/logos/${logo.id}/image`).buffer(true);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/png');

    const sheet = renderPdf(await getPdf(foreman, `/api/fields/${id}/logos/${logo.id}/grid.pdf`), 'logo-grid');
    const { data, info } = await sharp(sheet.pages[0]!).raw().toBuffer({ resolveWithObject: true });
    expect(info.width).toBeGreaterThan(info.height);
    // The logo's red is on the page (drawn over the grid), not only in the swatches.
    let red = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i]! > 150 && data[i + 1]! < 60 && data[i + 2]! < 60) red++;
    expect(red).toBeGreaterThan(2000);
    const text = sheet.text();
    expect(text).toMatch(/Reference corner R/);
    expect(text).toMatch(/White base coat under colours/);
    expect(text).toMatch(/Dark pigments/);
    sheet.remove();

    expect((await foreman.delete(`/api/fields/${id}/logos/${logo.id}?version=1`)).status).toBe(409);
    expect((await foreman.delete(`/api/fields/${id}/logos/${logo.id}?version=2`)).status).toBe(204);
    expect(await db().select().from(fieldLogos).where(eq(fieldLogos.fieldId, id))).toEqual([]);
    const audit = await db().select().from(auditLog).where(eq(auditLog.entity, 'field_logo')).orderBy(auditLog.id);
    expect(audit.map((a) => a.action)).toEqual(['create', 'update', 'delete']);
  });

  test('should refuse a crew lead, a partner and a foreman of another district before reading the upload', async () => {
    const id = api.fixture.fields.northLawn;
    const admin = await api.signIn('admin');
    const placed = await upload(admin, id, LOGO_SVG);
    expect(placed.status).toBe(201);
    for (const who of ['crew', 'partner', 'foremanSouth'] as const) {
      const agent = await api.signIn(who);
      expect((await upload(agent, id, LOGO_SVG)).status, who).toBe(403);
      expect((await agent.patch(`/api/fields/${id}/logos/${placed.body.logo.id}`).send({ rotationDeg: 'x' })).status, who).toBe(403);
      expect((await agent.delete(`/api/fields/${id}/logos/${placed.body.logo.id}?version=1`)).status, who).toBe(403);
    }
    // Those who may read the field (a crew lead once the crew has work there) read its logos and print the sheet.
    const crew = await api.signIn('crew');
    expect((await crew.get(`/api/fields/${id}/logos`)).status).toBe(403);
    await giveWork(db(), id, api.fixture.crews.north);
    expect((await crew.get(`/api/fields/${id}/logos`)).status).toBe(200);
    expect((await crew.get(`/api/fields/${id}/logos/${placed.body.logo.id}/grid.pdf`)).status).toBe(200);
    expect((await (await api.signIn('foremanSouth')).get(`/api/fields/${id}/logos`)).status).toBe(403);
    expect((await (await api.signIn('partner')).get(`/api/fields/${id}/logos`)).status).toBe(403);
    expect(await db().select().from(fieldLogos).where(eq(fieldLogos.fieldId, id))).toHaveLength(1);
  });

  test('should answer 400 for a bad placement and 404 for another field’s logo, writing nothing', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSchoolFootball;
    const placed = (await upload(foreman, id, LOGO_SVG)).body.logo;
    for (const body of [{ rotationDeg: 'x', version: 1 }, { widthM: 0, version: 1 }, { gridSpacingM: 0.1, widthM: 60, version: 1 }, { centerXM: 10 }, { name: '', version: 1 }]) {
      const res = await foreman.patch(`/api/fields/${id}/logos/${placed.id}`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect((await foreman.patch(`/api/fields/${api.fixture.fields.northSoccer}/logos/${placed.id}`).send({ rotationDeg: 5, version: 1 })).status).toBe(404);
    expect((await foreman.post(`/api/fields/${id}/logos`).field('name', 'No file')).body.error.code).toBe('field_logo/no_file');
    expect((await upload(foreman, id, LOGO_SVG, '')).status).toBe(400);
    const [row] = await db().select().from(fieldLogos).where(eq(fieldLogos.id, placed.id));
    expect(row!.version).toBe(1);
  });

  test('should clean scripts, handlers and outside links out of an SVG, and refuse what cannot be made safe', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const hostile = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="100" height="100" viewBox="0 0 100 100" onload="alert(1)">
      <script>alert('x')</script>
      <script xlink:href="https://evil.example/x.js"/>
      <rect id="r" width="100" height="60" fill="#c81010" onclick="steal()" onmouseover="steal()"/>
      <a href="javascript:alert(1)"><rect y="60" width="50" height="40" fill="#1030c0"/></a>
      <a xlink:href="javascript:alert(2)"><circle cx="75" cy="80" r="10" fill="#ffffff"/></a>
      <image href="https://evil.example/track.png" width="10" height="10"/>
      <image xlink:href="file:///etc/passwd" width="10" height="10"/>
      <use xlink:href="https://evil.example/sprite.svg#a"/>
      <use href="#r" x="0" y="0"/>
      <rect width="1" height="1" style="fill:url(https://evil.example/p.svg#g)"/>
      <style>@import url(https://evil.example/a.css); rect { fill: url(https://evil.example/b) }</style>
      <foreignObject width="100" height="100"><body xmlns="http://www.w3.org/1999/xhtml"><iframe src="https://evil.example"></iframe></body></foreignObject>
    </svg>`;
    const res = await upload(foreman, id, hostile, 'Hostile');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const stored = await storedText(res.body.logo.id);
    for (const bad of ['<script', 'onload', 'onclick', 'onmouseover', 'javascript:', 'evil.example', 'file:', '<foreignObject', '<iframe', '<image', '<style', '@import']) {
      expect(stored.toLowerCase(), bad).not.toContain(bad.toLowerCase());
    }
    // What is drawn is kept.
    expect(stored).toContain('fill="#c81010"');

    // Entity expansion, a huge declared size, a file too large, not a picture, nothing to paint.
    const bomb = `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><text>&b;</text><rect width="10" height="10" fill="red"/></svg>`;
    const refusedBomb = await upload(foreman, id, bomb);
    expect([refusedBomb.status, refusedBomb.body.error.code]).toEqual([415, 'field_logo/unsafe_svg']);
    const huge = await upload(foreman, id, '<svg xmlns="http://www.w3.org/2000/svg" width="100000" height="100000"><rect width="100000" height="100000" fill="red"/></svg>');
    expect([huge.status, huge.body.error.code]).toEqual([413, 'field_logo/too_many_pixels']);
    const big = await upload(foreman, id, `<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><!-- ${'x'.repeat(3 * 1024 * 1024)} --><rect width="10" height="10" fill="red"/></svg>`);
    expect([big.status, big.body.error.code]).toEqual([413, 'field_logo/too_large']);
    const jpeg = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#c81010' } }).jpeg().toBuffer();
    expect((await upload(foreman, id, jpeg)).body.error.code).toBe('field_logo/unsupported_format');
    expect((await upload(foreman, id, Buffer.from('hello, not a picture'))).body.error.code).toBe('field_logo/not_an_image');
    const empty = await upload(foreman, id, '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"></svg>');
    expect([empty.status, empty.body.error.code]).toEqual([400, 'field_logo/no_colours']);
    const rows = await db().select().from(fieldLogos).where(eq(fieldLogos.fieldId, id));
    expect(rows.map((r) => r.name)).toEqual(['Hostile']);
  });

  test('should take a PNG with transparency, its transparent pixels left as turf', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.southBaseball;
    const png = await sharp({ create: { width: 40, height: 20, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
      .composite([{ input: await sharp({ create: { width: 20, height: 20, channels: 4, background: '#ffd700' } }).png().toBuffer(), left: 0, top: 0 }])
      .png()
      .toBuffer();
    const res = await upload(await api.signIn('foremanSouth'), id, png, 'Gold half');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.logo.mime).toBe('image/png');
    expect(res.body.logo.colours).toEqual([{ hex: '#ffd700', share: 0.5 }]);
    expect(res.body.logo.paint.rows.map((r: { kind: string }) => r.kind)).toEqual(['colour', 'base']);
    expect((await upload(foreman, id, png)).status).toBe(403);
  });
});
