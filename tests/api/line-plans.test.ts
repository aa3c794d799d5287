import { readFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, fieldLinePlans } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { addEquipment } from '../support/fixture.ts';
import { linePlanBody } from '../support/bodies.ts';
import { getPdf, renderPdf } from '../support/pdf.ts';

const api = useTestApi();
const db = () => api.database.db;

const body = linePlanBody;

const marker = (districtId: number, name: string) => addEquipment(db(), { districtId, kind: 'line_marker', name, speedKmh: 4 });

describe('field line plans', () => {
  test('should let a foreman save a plan with a youth layout across the full pitch, versioned and audited', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const unit = await marker(api.fixture.districts.north, 'Walk-behind marker');
    const empty = await foreman.get(`/api/fields/${id}/lines`);
    expect(empty.status).toBe(200);
    expect(empty.body.linePlan).toMatchObject({ fieldId: id, layouts: [], version: null, seasonStart: '03-01' });
    expect(empty.body.linePlan.markers).toContainEqual({ id: unit, name: 'Walk-behind marker', speedKmh: 4 });

    const saved = await foreman.patch(`/api/fields/${id}/lines`).send(body({ markerId: unit }));
    expect(saved.status).toBe(200);
    expect(saved.body.linePlan).toMatchObject({ version: 1, markerId: unit, setByName: 'Test foreman', shifts: { '2026': { alongM: 2, acrossM: 0 } } });
    expect(saved.body.linePlan.layouts).toHaveLength(2);
    expect((await foreman.patch(`/api/fields/${id}/lines`).send(body())).body.error.code).toBe('field_line_plan/version_conflict');
    // Next season's shift is remembered beside this one's.
    const next = await foreman.patch(`/api/fields/${id}/lines`).send(body({ version: 1, shifts: { '2026': { alongM: 2, acrossM: 0 }, '2027': { alongM: -2, acrossM: 1 } } }));
    expect(next.body.linePlan.version).toBe(2);
    expect((await foreman.get(`/api/fields/${id}/lines`)).body.linePlan.shifts).toEqual({ '2026': { alongM: 2, acrossM: 0 }, '2027': { alongM: -2, acrossM: 1 } });
    const audit = await db().select().from(auditLog).where(eq(auditLog.entity, 'field_line_plan')).orderBy(auditLog.id);
    expect(audit.map((a) => a.action)).toEqual(['create', 'update']);
  });

  test('should let admin and head save; refuse crew lead, partner and another district’s foreman before the body, and let readers read as the abilities say', async () => {
    const id = api.fixture.fields.northSchoolFootball;
    let version: number | null = null;
    for (const who of ['admin', 'head'] as const) {
      const res: { status: number; body: { linePlan: { version: number } } } = await (await api.signIn(who)).patch(`/api/fields/${id}/lines`).send(body({ version }));
      expect(res.status, who).toBe(200);
      version = res.body.linePlan.version;
    }
    for (const who of ['crew', 'partner', 'foremanSouth'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.patch(`/api/fields/${id}/lines`).send(body({ version }))).status, who).toBe(403);
      // Refused before the body is read: a bad body is still a 403.
      expect((await agent.patch(`/api/fields/${id}/lines`).send({ layouts: 'x' })).status, who).toBe(403);
      // Reading follows reading the field itself.
      const field = await agent.get(`/api/fields/${id}`);
      expect((await agent.get(`/api/fields/${id}/lines`)).status, who).toBe(field.status);
      expect((await agent.get(`/api/fields/${id}/lines/set-out.pdf`)).status, who).toBe(field.status);
    }
    expect((await db().select().from(fieldLinePlans).where(eq(fieldLinePlans.fieldId, id)))[0]!.version).toBe(2);
  });

  test('should refuse an out-of-range size with the allowed range, a marker of another district, and answer 404 for no field', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northLawn;
    const big = await foreman.patch(`/api/fields/${id}/lines`).send(body({ layouts: [{ layout: 'soccer_full', lengthM: 130, widthM: 68, colour: '#ffffff' }] }));
    expect(big.status).toBe(400);
    expect(big.body.error.details.issues).toContainEqual(expect.objectContaining({ path: 'body.layouts.0.lengthM', message: expect.stringMatching(/between 90 and 120 m \(IFAB/) }));
    const football = await foreman.patch(`/api/fields/${id}/lines`).send(body({ layouts: [{ layout: 'football', lengthM: 100, widthM: null, colour: '#ffffff' }] }));
    expect(football.body.error.details.issues[0].message).toMatch(/fixed at 109.73 m/);
    for (const bad of [body({ shifts: { '2026': { alongM: 9, acrossM: 0 } } }), body({ paint: { dilutionWaterPerPaint: 1, coats: 0, passes: 2 } }), body({ seasonStart: '13-01' }), body({ markerId: await marker(api.fixture.districts.south, 'South marker') })]) {
      expect((await foreman.patch(`/api/fields/${id}/lines`).send(bad)).status).toBe(400);
    }
    expect(await db().select().from(fieldLinePlans).where(eq(fieldLinePlans.fieldId, id))).toEqual([]);
    expect((await foreman.patch('/api/fields/999999/lines').send(body())).status).toBe(404);
    // No plan yet: no set-out sheet, a clear 400.
    const none = await foreman.get(`/api/fields/${id}/lines/set-out.pdf`);
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/no line plan yet/);
  });

  test('should print the set-out sheet as a PDF that renders (pdftoppm)', async () => {
    const foreman = await api.signIn('admin');
    const id = api.fixture.fields.southBaseball;
    expect((await foreman.patch(`/api/fields/${id}/lines`).send(body())).status).toBe(200);
    for (const paper of ['a4', 'letter']) {
      const sheet = renderPdf(await getPdf(foreman, `/api/fields/${id}/lines/set-out.pdf?season=2026&paper=${paper}`), `set-out-sheet-${paper}`);
      const text = sheet.text(true);
      expect(text).toMatch(/Set-out sheet/);
      expect(text).toMatch(/Corner A \(reference\)/);
      expect(text).toMatch(/Diagonal A–C/);
      expect(text).toMatch(/118\.73 m/); // √(100² + 64²) = 118.727
      const png = readFileSync(sheet.pages[0]!);
      expect(png.subarray(1, 4).toString()).toBe('PNG');
      sheet.remove();
    }
    expect((await foreman.get(`/api/fields/${id}/lines/set-out.pdf?paper=a3`)).status).toBe(400);
  });
});
