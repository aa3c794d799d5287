/**
 * Imports of sites, fields and field outlines: an upload is checked row by row and kept
 * as a preview (nothing else written); a clean preview is committed in one transaction,
 * recording what it created and what rows looked like before it changed them, so the
 * caller's last import can be undone.
 */
import { and, desc, eq, gt, ne, or, sql, type SQL } from 'drizzle-orm';
import { type AppError, appError, errors, type ImportKind, type ImportList, type ImportRecord as ImportAnswerRecord, type ImportRow, type ImportSummary } from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { fields, imports, sites, users } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { createField, refuseDeleteWithHistory, removeField, removePhotoFiles, updateField } from './fields.ts';
import { readUpload, type UploadedFile } from './import-files.ts';
import { planImport } from './import-rows.ts';
import { followMove } from './scope-copies.ts';
import { createSite, updateSite } from './sites.ts';

type ImportRecord = typeof imports.$inferSelect;
type Changes = NonNullable<ImportRecord['changes']>;

const listColumns = {
  id: imports.id,
  kind: imports.kind,
  status: imports.status,
  userId: imports.userId,
  userName: users.name,
  districtId: imports.districtId,
  fileName: imports.fileName,
  summary: imports.summary,
  createdAt: imports.createdAt,
  committedAt: imports.committedAt,
  undoneAt: imports.undoneAt,
};

function present(row: ImportRecord & { userName: string | null }) {
  const { rows, changes, ...rest } = row;
  return {
    ...rest,
    rows: rows as ImportRow[],
    summary: row.summary as ImportSummary,
    changes: changes ? { created: changes.created.length, updated: changes.updated.length } : null,
  };
}

async function loadImport(db: Queryable, id: number) {
  const [row] = await db.select({ ...listColumns, rows: imports.rows, changes: imports.changes }).from(imports).leftJoin(users, eq(users.id, imports.userId)).where(eq(imports.id, id));
  return row;
}

/** The district a foreman's imports belong to; department-wide for the others. */
const importDistrict = (ctx: Ctx) => (ctx.actor.role === 'foreman' ? ctx.actor.districtId : null);

export async function previewImport(ctx: Ctx, kind: ImportKind, file: UploadedFile): Promise<ImportAnswerRecord<Date>> {
  authorize(ctx, 'create', 'Import');
  const raw = readUpload(kind, file);
  const plan = await planImport(ctx, kind, raw);
  const [created] = await ctx.db
    .insert(imports)
    .values({ kind, status: 'preview', userId: ctx.actor.id, districtId: importDistrict(ctx), fileName: file.originalname.slice(0, 200), rows: plan.rows, summary: plan.summary })
    .returning({ id: imports.id });
  return present((await loadImport(ctx.db, created!.id))!);
}

function readable(ctx: Ctx, row: { userId: number; districtId: number | null }): boolean {
  return row.userId === ctx.actor.id || can(ctx, 'read', 'Import', { districtId: row.districtId });
}

export async function getImport(ctx: Ctx, id: number): Promise<ImportAnswerRecord<Date>> {
  authorize(ctx, 'create', 'Import');
  const row = await loadImport(ctx.db, id);
  if (!row || !readable(ctx, row)) throw errors.notFound('import', id);
  return present(row);
}

export async function listImports(ctx: Ctx, limit: number): Promise<ImportList<Date>> {
  authorize(ctx, 'create', 'Import');
  const scope: SQL | undefined =
    ctx.actor.role === 'foreman' ? or(eq(imports.userId, ctx.actor.id), eq(imports.districtId, ctx.actor.districtId ?? -1)) : undefined;
  const items = await ctx.db
    .select(listColumns)
    .from(imports)
    .leftJoin(users, eq(users.id, imports.userId))
    .where(scope)
    .orderBy(desc(imports.id))
    .limit(limit);
  const [last] = await ctx.db
    .select({ id: imports.id })
    .from(imports)
    .where(and(eq(imports.userId, ctx.actor.id), eq(imports.status, 'committed')))
    .orderBy(desc(imports.committedAt), desc(imports.id))
    .limit(1);
  return { items: items.filter((row) => readable(ctx, row)), lastCommittedId: last?.id ?? null };
}

async function ownImport(ctx: Ctx, tx: Queryable, id: number) {
  // Lock the row so two commits (or a commit and an undo) of one import cannot interleave.
  const [row] = await tx.select().from(imports).where(eq(imports.id, id)).for('update');
  if (!row || !readable(ctx, row)) throw errors.notFound('import', id);
  if (row.userId !== ctx.actor.id) throw errors.forbidden('Only the person who uploaded an import may commit or undo it');
  return row;
}

export async function commitImport(ctx: Ctx, id: number): Promise<ImportAnswerRecord<Date>> {
  authorize(ctx, 'create', 'Import');
  return (ctx.db as Db).transaction(async (tx) => {
    const record = await ownImport(ctx, tx, id);
    if (record.status !== 'preview') throw appError('import/not_preview', `This import is already ${record.status}; upload the file again to import it anew`);
    const summary = record.summary as ImportSummary;
    if (summary.errors > 0) {
      throw appError('import/has_errors', `${summary.errors} row${summary.errors === 1 ? ' has' : 's have'} errors; fix ${summary.errors === 1 ? 'it' : 'them'} in the file and upload it again`, { errors: summary.errors });
    }
    const txCtx: Ctx = { ...ctx, db: tx };
    // Check again inside the transaction: rows may have changed since the preview.
    const stored = record.rows as ImportRow[];
    const plan = await planImport(txCtx, record.kind, stored.map((r) => ({ row: r.row, data: r.data })));
    if (plan.summary.errors > 0) {
      throw appError('import/stale', `Since the preview, ${plan.summary.errors} row${plan.summary.errors === 1 ? '' : 's'} no longer pass the checks (someone changed the data); upload the file again`, { errors: plan.summary.errors });
    }
    const changes: Changes = { created: [], updated: [] };
    // An update keeps the row as it was, so the import can be undone.
    const update = async (entity: 'site' | 'field', table: typeof sites | typeof fields, id: number, run: () => Promise<unknown>) => {
      const [before] = await tx.select().from(table).where(eq(table.id, id));
      await run();
      changes.updated.push({ entity, id, before: JSON.parse(JSON.stringify(before)) });
    };
    for (const write of plan.writes) {
      switch (write.op) {
        case 'createSite':
          changes.created.push({ entity: 'site', id: (await createSite(txCtx, write.input)).id });
          break;
        case 'updateSite':
          await update('site', sites, write.id, () => updateSite(txCtx, write.id, write.input));
          break;
        case 'createField':
          changes.created.push({ entity: 'field', id: (await createField(txCtx, write.input)).id });
          break;
        case 'updateField':
          await update('field', fields, write.id, () => updateField(txCtx, write.id, write.input));
          break;
      }
    }
    await tx.update(imports).set({ status: 'committed', committedAt: new Date(), changes, rows: plan.rows, summary: plan.summary }).where(eq(imports.id, id));
    await writeAudit(tx, {
      actorId: ctx.actor.id,
      action: 'update',
      entity: 'import',
      entityId: id,
      districtId: record.districtId,
      before: { status: 'preview' },
      after: { status: 'committed', fileName: record.fileName, created: changes.created.length, updated: changes.updated.length },
    });
    return present((await loadImport(tx, id))!);
  });
}

function changedSince(entity: string, id: number): AppError {
  return appError('import/changed_since', `The ${entity} with id ${id} was changed after the import; undoing would lose that change, so nothing was undone`, { entity, id });
}

/** Stored columns of a row as they were before the import, ready to write back. */
function restorable(before: Record<string, unknown>) {
  const { id: _id, version: _v, createdAt: _c, updatedAt: _u, ...rest } = before;
  void _id;
  void _v;
  void _c;
  void _u;
  return rest;
}

export async function undoImport(ctx: Ctx, id: number, uploadsDir: string): Promise<ImportAnswerRecord<Date>> {
  authorize(ctx, 'create', 'Import');
  const photoFiles: string[] = [];
  const undone = await (ctx.db as Db).transaction(async (tx) => {
    const record = await ownImport(ctx, tx, id);
    if (record.status !== 'committed') throw appError('import/not_committed', `Only a committed import can be undone; this one is ${record.status}`);
    const [later] = await tx
      .select({ id: imports.id })
      .from(imports)
      .where(and(eq(imports.userId, ctx.actor.id), eq(imports.status, 'committed'), ne(imports.id, id), gt(imports.committedAt, record.committedAt!)))
      .limit(1);
    if (later) throw appError('import/not_last', `Only your last import can be undone; undo import ${later.id} first`);
    const changes = record.changes ?? { created: [], updated: [] };
    const createdFieldIds = changes.created.filter((c) => c.entity === 'field').map((c) => c.id);
    const createdSiteIds = changes.created.filter((c) => c.entity === 'site').map((c) => c.id);

    // Fields before sites: a created site may hold created fields.
    for (const fieldId of createdFieldIds) {
      const [row] = await tx.select().from(fields).where(eq(fields.id, fieldId));
      if (!row || row.version !== 1) throw changedSince('field', fieldId);
      // Work done on an imported field since is the department's record: the undo stops, as a delete would.
      await refuseDeleteWithHistory(tx, row);
      const [site] = await tx.select({ districtId: sites.districtId }).from(sites).where(eq(sites.id, row.siteId));
      photoFiles.push(...(await removeField(tx, fieldId)).photoFiles);
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'field', entityId: fieldId, districtId: site?.districtId ?? null, before: row, after: null });
    }
    for (const siteId of createdSiteIds) {
      const [row] = await tx.select().from(sites).where(eq(sites.id, siteId));
      if (!row || row.version !== 1) throw changedSince('site', siteId);
      const [others] = await tx.select({ n: sql<number>`count(*)::int` }).from(fields).where(eq(fields.siteId, siteId));
      if ((others?.n ?? 0) > 0) {
        throw appError('import/changed_since', `Fields were added to the site “${row.name}” after the import; remove them first or keep the import`, { entity: 'site', id: siteId });
      }
      await tx.delete(sites).where(eq(sites.id, siteId));
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'site', entityId: siteId, districtId: row.districtId, before: row, after: null });
    }
    for (const u of changes.updated) {
      const table = u.entity === 'site' ? sites : fields;
      const [current] = await tx.select().from(table).where(eq(table.id, u.id));
      // The import bumped the version by one; anything beyond is someone else's change.
      if (!current || current.version !== Number(u.before.version) + 1) throw changedSince(u.entity, u.id);
      const restored = restorable(u.before);
      await tx
        .update(table)
        .set({ ...restored, version: sql`${table.version} + 1`, updatedAt: new Date() } as never)
        .where(eq(table.id, u.id));
      const [after] = await tx.select().from(table).where(eq(table.id, u.id));
      // A restored site or field may sit elsewhere than the import left it: copies follow.
      await followMove(tx, ctx.actor.id, u.entity === 'site' ? { siteId: u.id } : { fieldId: u.id });
      const districtId =
        u.entity === 'site'
          ? (after as typeof sites.$inferSelect).districtId
          : ((await tx.select({ d: sites.districtId }).from(sites).where(eq(sites.id, (after as typeof fields.$inferSelect).siteId)))[0]?.d ?? null);
      await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: u.entity, entityId: u.id, districtId, before: current, after: after ?? null });
    }
    await tx.update(imports).set({ status: 'undone', undoneAt: new Date() }).where(eq(imports.id, id));
    await writeAudit(tx, {
      actorId: ctx.actor.id,
      action: 'update',
      entity: 'import',
      entityId: id,
      districtId: record.districtId,
      before: { status: 'committed' },
      after: { status: 'undone', removed: changes.created.length, restored: changes.updated.length },
    });
    return present((await loadImport(tx, id))!);
  });
  await removePhotoFiles(uploadsDir, photoFiles);
  return undone;
}
