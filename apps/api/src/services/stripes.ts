/**
 * A field's stripe pattern: read with the district's mowers the pass plan may be worked out
 * for, set or cleared by those who may change the field. The week plan reads the pattern for
 * the field's mowing orders.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { errors, MOWER_KINDS, stripeMowerOf, type FieldStripes, type SetFieldStripesInput, type StripeMowerChoice, type StripePattern } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { equipment, fieldStripes, users } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import type { Ctx } from './context.ts';
import { authorizeFieldWrite } from './field-write.ts';
import { getField } from './fields.ts';
import { loadParameters } from './standards.ts';

async function stripeRow(db: Queryable, fieldId: number) {
  const [row] = await db
    .select({ id: fieldStripes.id, fieldId: fieldStripes.fieldId, pattern: fieldStripes.pattern, mowerId: fieldStripes.mowerId, version: fieldStripes.version, updatedAt: fieldStripes.updatedAt, setByName: users.name })
    .from(fieldStripes)
    .leftJoin(users, eq(users.id, fieldStripes.setBy))
    .where(eq(fieldStripes.fieldId, fieldId));
  return row;
}

async function districtMowers(db: Queryable, districtId: number): Promise<StripeMowerChoice[]> {
  const params = await loadParameters(db);
  const rows = await db
    .select({ id: equipment.id, name: equipment.name, kind: equipment.kind, cuttingWidthM: equipment.cuttingWidthM, speedKmh: equipment.speedKmh, fieldEfficiency: equipment.fieldEfficiency })
    .from(equipment)
    .where(and(eq(equipment.districtId, districtId), eq(equipment.active, true), inArray(equipment.kind, [...MOWER_KINDS])))
    .orderBy(asc(equipment.name), asc(equipment.id));
  return rows.map((r) => ({ id: r.id, name: r.name, kind: r.kind, ...stripeMowerOf(r, params) }));
}

async function answer(db: Queryable, field: { id: number; districtId: number }): Promise<FieldStripes<Date>> {
  const [row, mowers, params] = await Promise.all([stripeRow(db, field.id), districtMowers(db, field.districtId), loadParameters(db)]);
  return {
    fieldId: field.id,
    pattern: row?.pattern ?? null,
    mowerId: row?.mowerId ?? null,
    version: row?.version ?? null,
    updatedAt: row?.updatedAt ?? null,
    setByName: row?.setByName ?? null,
    mowers,
    defaultMower: stripeMowerOf(null, params),
  };
}

/** The field's pattern and the mowers it may be planned for; anyone who may read the field. */
export async function getFieldStripes(ctx: Ctx, fieldId: number): Promise<FieldStripes<Date>> {
  const field = await getField(ctx, fieldId);
  return answer(ctx.db, field);
}

/**
 * Sets (or, with `pattern: null`, clears) the field's pattern at the version the caller read;
 * a mower must be an active mower of the field's district. Audited as `field_stripes`.
 */
export async function setFieldStripes(ctx: Ctx, fieldId: number, input: SetFieldStripesInput): Promise<FieldStripes<Date>> {
  return (ctx.db as Db).transaction(async (tx) => {
    const field = await authorizeFieldWrite(ctx, fieldId, tx);
    if (input.mowerId !== null) {
      const [unit] = await tx.select({ id: equipment.id }).from(equipment).where(and(eq(equipment.id, input.mowerId), eq(equipment.districtId, field.districtId), eq(equipment.active, true), inArray(equipment.kind, [...MOWER_KINDS])));
      if (!unit) throw errors.noSuch(`mower in ${field.name}’s district`, 'body.mowerId');
    }
    const [before] = await tx.select().from(fieldStripes).where(eq(fieldStripes.fieldId, fieldId));
    if ((before?.version ?? null) !== input.version) throw errors.versionConflict('field_stripes');
    let after: typeof before | null = null;
    if (input.pattern === null) {
      if (before) {
        const gone = await tx.delete(fieldStripes).where(and(eq(fieldStripes.id, before.id), eq(fieldStripes.version, before.version))).returning({ id: fieldStripes.id });
        if (!gone.length) throw errors.versionConflict('field_stripes');
      }
    } else if (before) {
      [after] = await tx
        .update(fieldStripes)
        .set({ pattern: input.pattern, mowerId: input.mowerId, setBy: ctx.actor.id, version: before.version + 1, updatedAt: new Date() })
        .where(and(eq(fieldStripes.id, before.id), eq(fieldStripes.version, before.version)))
        .returning();
      if (!after) throw errors.versionConflict('field_stripes');
    } else {
      // Two first settings at once: the unique index on the field refuses the second.
      [after] = await tx.insert(fieldStripes).values({ fieldId, pattern: input.pattern, mowerId: input.mowerId, setBy: ctx.actor.id }).onConflictDoNothing().returning();
      if (!after) throw errors.versionConflict('field_stripes');
    }
    if (before || after) {
      const action = !before ? 'create' : !after ? 'delete' : 'update';
      await writeAudit(tx, { actorId: ctx.actor.id, action, entity: 'field_stripes', entityId: (after ?? before)!.id, districtId: field.districtId, before: before ?? null, after: after ?? null });
    }
    return answer(tx, field);
  });
}

/** Patterns of a set of fields, for the week plan. */
export async function stripePatternsOf(db: Queryable, fieldIds: number[]) {
  if (!fieldIds.length) return new Map<number, { pattern: StripePattern; mowerId: number | null }>();
  const rows = await db.select({ fieldId: fieldStripes.fieldId, pattern: fieldStripes.pattern, mowerId: fieldStripes.mowerId }).from(fieldStripes).where(inArray(fieldStripes.fieldId, fieldIds));
  return new Map(rows.map((r) => [r.fieldId, { pattern: r.pattern, mowerId: r.mowerId }]));
}
