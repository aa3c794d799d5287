/** The department's Standards (one row per maintenance level) and its engine parameters. */
import { asc, eq, sql } from 'drizzle-orm';
import {
  DEFAULT_PARAMETERS,
  DEFAULT_STANDARDS,
  LEVELS,
  culturalProgramsOf,
  type CulturalPrograms,
  type DepartmentParameters,
  type Level,
  type LevelStandard,
  type Standards,
  type StandardsAnswer,
  type StandardsRow as StandardsAnswerRow,
  type UpdateLevelStandardInput,
  errors,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { settings, standards } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

/** Settings key under which a department may keep its own engine parameters. */
const PARAMETERS_KEY = 'department_parameters';

export type StandardsRow = StandardsAnswerRow<Date>;

async function rows(db: Queryable): Promise<StandardsRow[]> {
  const found = await db.select().from(standards).orderBy(asc(standards.level));
  return found.map((r) => ({ ...r, level: r.level as Level }));
}

/**
 * The Standards as the engine takes them. A level without a row (an installation that never
 * saved it) falls back to the demo default, and `missing` names it so callers can say so.
 */
export async function loadStandards(db: Queryable): Promise<{ standards: Standards; versions: Record<Level, number | null>; missing: Level[] }> {
  const found = await rows(db);
  const out = { ...DEFAULT_STANDARDS };
  const versions = { 1: null, 2: null, 3: null, 4: null } as Record<Level, number | null>;
  for (const r of found) {
    out[r.level] = { ...DEFAULT_STANDARDS[r.level], ...r.data, level: r.level };
    versions[r.level] = r.version;
  }
  return { standards: out, versions, missing: LEVELS.filter((l) => versions[l] === null) };
}

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * The department's parameters: its own saved ones over the defaults, group by group, so a
 * setting added to a group after the department saved it (e.g. a new irrigation or paint
 * setting) takes its default instead of going missing.
 */
export async function loadParameters(db: Queryable): Promise<DepartmentParameters> {
  const [row] = await db.select().from(settings).where(eq(settings.key, PARAMETERS_KEY));
  if (!row || !isPlainObject(row.value)) return DEFAULT_PARAMETERS;
  const out: Record<string, unknown> = { ...DEFAULT_PARAMETERS };
  for (const [key, saved] of Object.entries(row.value)) {
    const base = (DEFAULT_PARAMETERS as unknown as Record<string, unknown>)[key];
    out[key] = isPlainObject(base) && isPlainObject(saved) ? { ...base, ...saved } : saved;
  }
  return out as unknown as DepartmentParameters;
}

export async function listStandards(ctx: Ctx): Promise<StandardsAnswer<Date>> {
  authorize(ctx, 'read', 'Standards');
  return { levels: await rows(ctx.db), parameters: await loadParameters(ctx.db) };
}

function merge(data: LevelStandard, changes: Omit<UpdateLevelStandardInput, 'version'>): LevelStandard {
  const next: LevelStandard = { ...data, hocMm: { ...data.hocMm }, hocByGrassMm: { ...data.hocByGrassMm } };
  const { hocMm, hocByGrassMm, cultural, ...plain } = changes;
  Object.assign(next, plain);
  // A task's program is replaced whole; the tasks not sent keep theirs.
  if (cultural) next.cultural = { ...culturalProgramsOf(data), ...(cultural as Partial<CulturalPrograms>) };
  for (const [sport, seasons] of Object.entries(hocMm ?? {}) as [keyof LevelStandard['hocMm'], { cool?: number; warm?: number }][]) {
    next.hocMm[sport] = { ...next.hocMm[sport], ...seasons };
  }
  for (const [grass, mm] of Object.entries(hocByGrassMm ?? {}) as [keyof LevelStandard['hocByGrassMm'], number | null][]) {
    if (mm === null) delete next.hocByGrassMm[grass];
    else next.hocByGrassMm[grass] = mm;
  }
  return next;
}

/** Changes one level; the version must be the one the caller read (else 409). Audited. */
export async function updateLevelStandard(ctx: Ctx, level: Level, input: UpdateLevelStandardInput): Promise<StandardsRow> {
  authorize(ctx, 'update', 'Standards');
  return (ctx.db as Db).transaction(async (tx) => {
    const [before] = await tx.select().from(standards).where(eq(standards.level, level));
    if (!before) throw errors.notFound('standards', level);
    const { version, ...changes } = input;
    const data = merge({ ...DEFAULT_STANDARDS[level], ...before.data, level }, changes);
    const [after] = await tx
      .update(standards)
      .set({ data, version: sql`${standards.version} + 1`, updatedAt: new Date(), updatedBy: ctx.actor.id })
      .where(sql`${standards.level} = ${level} and ${standards.version} = ${version}`)
      .returning();
    if (!after) throw errors.versionConflict('standards');
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'standards', entityId: level, districtId: null, before, after });
    return { ...after, level: after.level as Level };
  });
}
