/**
 * A field's line plan: read by anyone who may read the field, saved by those who may change
 * it (admin, or the head or foreman of its district). The set-out sheet PDF is drawn from the
 * same figures the page shows (the domain's `linePlanFigures`).
 */
import { and, asc, between, eq } from 'drizzle-orm';
import { errors, fieldFrame, fieldFrameToLngLat, linePlanFigures, type FieldLinePlan, type LineMarkerChoice, type Polygon, type SetFieldLinePlanInput } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { equipment, fieldEvents, fieldLinePlans, users } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import type { Ctx } from './context.ts';
import { authorizeFieldWrite } from './field-write.ts';
import { getField } from './fields.ts';
import { pdfDocument } from './pdf.ts';
import { loadParameters, loadStandards } from './standards.ts';

async function markersOf(db: Queryable, districtId: number, defaultSpeed: number): Promise<LineMarkerChoice[]> {
  const rows = await db
    .select({ id: equipment.id, name: equipment.name, speedKmh: equipment.speedKmh })
    .from(equipment)
    .where(and(eq(equipment.districtId, districtId), eq(equipment.active, true), eq(equipment.kind, 'line_marker')))
    .orderBy(asc(equipment.name), asc(equipment.id));
  return rows.map((r) => ({ id: r.id, name: r.name, speedKmh: r.speedKmh ?? defaultSpeed }));
}

async function answer(ctx: Ctx, db: Queryable, field: { id: number; districtId: number; maintenanceLevel: number }): Promise<FieldLinePlan<Date>> {
  const today = ctx.clock.today();
  const year = Number(today.slice(0, 4));
  const [[row], params, { standards }, events] = await Promise.all([
    db
      .select({ plan: fieldLinePlans, setByName: users.name })
      .from(fieldLinePlans)
      .leftJoin(users, eq(users.id, fieldLinePlans.setBy))
      .where(eq(fieldLinePlans.fieldId, field.id)),
    loadParameters(db),
    loadStandards(db),
    db
      .select({ date: fieldEvents.startsOn, title: fieldEvents.title })
      .from(fieldEvents)
      .where(and(eq(fieldEvents.fieldId, field.id), between(fieldEvents.startsOn, `${year - 1}-01-01`, `${year + 1}-12-31`)))
      .orderBy(asc(fieldEvents.startsOn)),
  ]);
  const plan = row?.plan;
  return {
    fieldId: field.id,
    layouts: plan?.layouts ?? [],
    paint: plan?.paint ?? { dilutionWaterPerPaint: params.lines.firstCoat.dilutionWaterPerPaint, coats: 1, passes: params.lines.firstCoat.passes },
    markerId: plan?.markerId ?? null,
    seasonStart: plan?.seasonStart ?? '03-01',
    seasonEnd: plan?.seasonEnd ?? '11-30',
    shifts: plan?.shifts ?? {},
    version: plan?.version ?? null,
    updatedAt: plan?.updatedAt ?? null,
    setByName: row?.setByName ?? null,
    settings: params.lines,
    markers: await markersOf(db, field.districtId, params.lines.markerSpeedKmh),
    repaintDays: standards[field.maintenanceLevel as keyof typeof standards]?.lineRepaintDays ?? null,
    events,
    today,
  };
}

/** The field's line plan (empty while it has none); anyone who may read the field. */
export async function getFieldLinePlan(ctx: Ctx, fieldId: number): Promise<FieldLinePlan<Date>> {
  const field = await getField(ctx, fieldId);
  return answer(ctx, ctx.db, field);
}

/**
 * Saves the field's line plan at the version the caller read; a marker must be an active line
 * marker of the field's district. Audited as `field_line_plan`.
 */
export async function setFieldLinePlan(ctx: Ctx, fieldId: number, input: SetFieldLinePlanInput): Promise<FieldLinePlan<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const scope = await authorizeFieldWrite(ctx, fieldId, tx);
    if (input.markerId !== null) {
      const [unit] = await tx.select({ id: equipment.id }).from(equipment).where(and(eq(equipment.id, input.markerId), eq(equipment.districtId, scope.districtId), eq(equipment.active, true), eq(equipment.kind, 'line_marker')));
      if (!unit) throw errors.noSuch(`line marker in ${scope.name}’s district`, 'body.markerId');
    }
    const [before] = await tx.select().from(fieldLinePlans).where(eq(fieldLinePlans.fieldId, fieldId));
    if ((before?.version ?? null) !== input.version) throw errors.versionConflict('field_line_plan');
    const values = { layouts: input.layouts, paint: input.paint, markerId: input.markerId, seasonStart: input.seasonStart, seasonEnd: input.seasonEnd, shifts: input.shifts, setBy: ctx.actor.id };
    let after: typeof before;
    if (before) {
      [after] = await tx
        .update(fieldLinePlans)
        .set({ ...values, version: before.version + 1, updatedAt: new Date() })
        .where(and(eq(fieldLinePlans.id, before.id), eq(fieldLinePlans.version, before.version)))
        .returning();
    } else {
      // Two first saves at once: the unique index on the field refuses the second.
      [after] = await tx.insert(fieldLinePlans).values({ fieldId, ...values }).onConflictDoNothing().returning();
    }
    if (!after) throw errors.versionConflict('field_line_plan');
    await writeAudit(tx, { actorId: ctx.actor.id, action: before ? 'update' : 'create', entity: 'field_line_plan', entityId: after.id, districtId: scope.districtId, before: before ?? null, after });
    const field = await getField({ ...ctx, db: tx }, fieldId);
    return answer(ctx, tx, field);
  });
}

/** The figures of a saved plan for a season, with the field's outline they sit on. */
export async function linePlanFiguresOf(ctx: Ctx, fieldId: number, season: string) {
  const field = await getField(ctx, fieldId);
  const plan = await answer(ctx, ctx.db, field);
  const frame = fieldFrame(field.geometry as Polygon);
  const marker = plan.markers.find((m) => m.id === plan.markerId);
  const figures = linePlanFigures(plan, frame, season, plan.settings, marker?.speedKmh ?? plan.settings.markerSpeedKmh, plan.repaintDays, plan.events);
  return { field, plan, frame, figures, marker, toLngLat: fieldFrameToLngLat(field.geometry as Polygon) };
}

const fmt = (v: number, d = 2) => v.toFixed(d);

/**
 * The string-line set-out sheet as a PDF (A4 or Letter): the plan drawn to scale on the field's
 * outline, then for each layout its reference corner, points as (along, across) from it and
 * as coordinates, and the tape checks.
 */
export async function setOutPdf(ctx: Ctx, fieldId: number, season: string, paper: 'A4' | 'LETTER'): Promise<Buffer> {
  const { field, frame, figures, toLngLat } = await linePlanFiguresOf(ctx, fieldId, season);
  if (!figures.layouts.length) throw errors.invalid(`${field.name} has no line plan yet: add a layout first`, []);
  const { doc, done } = pdfDocument({ size: paper, margin: 40, info: { Title: `Set-out sheet, ${field.name}, ${season}`, Author: 'Swardwise' } });
  const left = doc.page.margins.left;
  const usable = doc.page.width - left - doc.page.margins.right;

  doc.font('Helvetica-Bold').fontSize(16).text(`Set-out sheet: ${field.name}`);
  doc.font('Helvetica').fontSize(10).fillColor('#333333');
  doc.text(`${field.siteName} · ${field.districtName} · season ${season} · printed ${ctx.clock.today()}`);
  doc.text(`Field ${fmt(frame.lengthM, 1)} × ${fmt(frame.widthM, 1)} m, long axis ${fmt(frame.bearingDeg, 0)}° from north. Season shift: ${fmt(figures.shift.alongM, 1)} m along, ${fmt(figures.shift.acrossM, 1)} m across.`);
  doc.moveDown(0.5);

  // The plan, to scale, long axis left to right.
  const scale = Math.min(usable / frame.lengthM, 220 / frame.widthM);
  const ox = left + (usable - frame.lengthM * scale) / 2;
  const oy = doc.y + 4;
  const X = (x: number) => ox + x * scale;
  const Y = (y: number) => oy + (frame.widthM - y) * scale;
  doc.save();
  const [p0, ...rest] = frame.points;
  if (p0) {
    doc.moveTo(X(p0[0]), Y(p0[1]));
    for (const p of rest) doc.lineTo(X(p[0]), Y(p[1]));
    doc.closePath().fillAndStroke('#5f8f4e', '#2f4f27');
  }
  for (const l of figures.layouts) {
    // White lines print as dark grey on paper; the other colours as chosen.
    const ink = l.colour.toLowerCase() === '#ffffff' ? '#ffffff' : l.colour;
    doc.lineWidth(Math.max(0.6, l.template.lineWidthM * scale)).strokeColor(ink);
    for (const s of l.segments) {
      if (s.kind === 'line') doc.moveTo(X(s.from[0]), Y(s.from[1])).lineTo(X(s.to[0]), Y(s.to[1])).stroke();
      else {
        const n = Math.max(8, Math.ceil(Math.abs(s.endRad - s.startRad) * 12));
        for (let i = 0; i <= n; i++) {
          const a = s.startRad + ((s.endRad - s.startRad) * i) / n;
          const px = X(s.center[0] + s.radiusM * Math.cos(a));
          const py = Y(s.center[1] + s.radiusM * Math.sin(a));
          if (i === 0) doc.moveTo(px, py);
          else doc.lineTo(px, py);
        }
        doc.stroke();
      }
    }
    const a = l.sheet.points[0];
    if (a) doc.circle(X(a.fieldX), Y(a.fieldY), 3).fill('#c00000');
  }
  doc.restore();
  doc.y = oy + frame.widthM * scale + 8;
  doc.x = left;
  doc.fontSize(8).fillColor('#333333').text(`Drawn to scale (1 : ${Math.round(1 / (scale * 0.0254 / 72)).toLocaleString('en-US')}); red dot: each layout's reference corner.`, left, doc.y);

  for (const l of figures.layouts) {
    doc.moveDown(0.8);
    doc.font('Helvetica-Bold').fontSize(12).fillColor('#000000').text(`${l.index + 1}. ${l.name}`, left);
    doc.font('Helvetica').fontSize(9).fillColor('#333333').text(`Colour ${l.colour} · source: ${l.source} · reference: ${l.sheet.reference}`, left);
    doc.moveDown(0.3);
    const cols = [{ t: 'Point', w: 0.34 }, { t: 'Along (m)', w: 0.12 }, { t: 'Across (m)', w: 0.12 }, { t: 'Latitude', w: 0.21 }, { t: 'Longitude', w: 0.21 }];
    const row = (cells: string[], bold = false) => {
      if (doc.y > doc.page.height - doc.page.margins.bottom - 14) doc.addPage();
      const y = doc.y;
      let x = left;
      doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(9).fillColor('#000000');
      cells.forEach((c, i) => {
        const w = usable * cols[i]!.w;
        doc.text(c, x, y, { width: w - 4, lineBreak: false, align: i === 0 ? 'left' : 'right' });
        x += w;
      });
      doc.y = y + 12;
    };
    row(cols.map((c) => c.t), true);
    for (const p of l.sheet.points) {
      const [lng, lat] = toLngLat(p.fieldX, p.fieldY);
      row([p.name, fmt(p.alongM), fmt(p.acrossM), lat.toFixed(6), lng.toFixed(6)]);
    }
    doc.moveDown(0.3);
    doc.font('Helvetica-Bold').fontSize(9).text('Tape checks', left);
    doc.font('Helvetica');
    for (const c of l.sheet.checks) doc.text(`${c.label}: ${c.between[0]} to ${c.between[1]} = ${fmt(c.expectedM)} m`, left);
  }
  doc.moveDown(0.8);
  doc.fontSize(8).fillColor('#333333').text('Check the diagonals agree within a few centimetres before painting. Lines on a wet or slippery surface, or near traffic, need the usual care; follow the paint label.', left);
  doc.end();
  return done;
}
