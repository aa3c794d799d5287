/**
 * The season budget: per line, what the head set, what the turf engine's outlook says the
 * season takes, and what the work records show was used to date, priced with the
 * department's cost settings. A foreman reads his district's; the head reads and sets any.
 */
import { and, eq, gte, lte, sql } from 'drizzle-orm';
import {
  actualBudgetFigures,
  BUDGET_LINE_FACTS,
  BUDGET_LINES,
  errors,
  outlookBudgetFigures,
  productKgApplied,
  type ActualUse,
  type BudgetAnswer,
  type BudgetFigure,
  type BudgetLine,
  type BudgetLineInput,
  type BudgetQuery,
  type EquipmentKind,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { applications, budgetLines, districts, equipment, fields, workOrders } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';
import { readCosts } from './costs.ts';
import { cachedSeasonOutlooks } from './season-outlook.ts';

const r2 = (v: number) => Math.round(v * 100) / 100;
const rounded = (f: BudgetFigure): BudgetFigure => ({ quantity: r2(f.quantity), cost: f.cost === null ? null : r2(f.cost) });

/**
 * The scope a caller reads: the district asked for, or for a foreman his own when none is
 * asked; the department (null) for the head. Checked before anything is read.
 */
export function budgetScope(ctx: Ctx, districtId: number | undefined, action: 'read' | 'update' = 'read'): number | null {
  const scope = districtId ?? (ctx.actor.role === 'foreman' ? ctx.actor.districtId : null);
  authorize(ctx, action, 'Budget', { districtId: scope });
  return scope;
}

async function scopeName(db: Queryable, districtId: number | null, path: string): Promise<string> {
  if (districtId === null) return 'Department';
  const [d] = await db.select({ name: districts.name }).from(districts).where(eq(districts.id, districtId));
  if (!d) throw errors.noSuch('district', path);
  return d.name;
}

/** A number from a work order's details, 0 when it is missing or not a number. */
const detail = (key: string) => sql<number>`case when jsonb_typeof(${workOrders.details} -> ${key}) = 'number' then (${workOrders.details} ->> ${key})::float8 else 0 end`;

/** What the work records show was used from `from` to `to`: done work orders and recorded applications, summed in SQL. */
export async function actualUse(db: Queryable, districtId: number | null, from: string, to: string, precipRateMmPerH: number): Promise<ActualUse> {
  const done = and(eq(workOrders.status, 'done'), gte(workOrders.plannedDate, from), lte(workOrders.plannedDate, to), districtId === null ? undefined : eq(workOrders.districtId, districtId));
  const hours = sql<number>`sum(coalesce(${workOrders.actualHours}, ${workOrders.plannedHours}))::float8`;
  const byCrew = await db.select({ crewId: workOrders.crewId, hours }).from(workOrders).where(done).groupBy(workOrders.crewId);
  const byEquipment = await db
    .select({ kind: equipment.kind, hours })
    .from(workOrders)
    .innerJoin(equipment, eq(equipment.id, workOrders.equipmentId))
    .where(done)
    .groupBy(equipment.kind);
  // Water: an automatic controller's order carries the week's volume; a quick-coupler run its run time at the heads' rate.
  const [products] = await db
    .select({
      nKg: sql<number>`coalesce(sum(${detail('nGPerM2')} * ${fields.areaM2} / 1000) filter (where ${workOrders.task} = 'feed'), 0)::float8`,
      waterM3: sql<number>`coalesce(sum(case when ${workOrders.details} ->> 'system' = 'automatic' then ${detail('volumeL')} / 1000
        else ${detail('runTimeMin')} / 60 * ${precipRateMmPerH}::float8 * ${fields.areaM2} / 1000 end) filter (where ${workOrders.task} = 'irrigate'), 0)::float8`,
      paintL: sql<number>`coalesce(sum(${detail('paintL')}) filter (where ${workOrders.task} = 'paint_lines'), 0)::float8`,
    })
    .from(workOrders)
    .innerJoin(fields, eq(fields.id, workOrders.fieldId))
    .where(done);
  const seed = await db
    .select({ rateUnit: applications.rateUnit, rateArea: sql<number>`sum(${applications.rate} * ${applications.areaM2})::float8` })
    .from(applications)
    .where(and(eq(applications.task, 'overseed'), gte(applications.appliedOn, from), lte(applications.appliedOn, to), districtId === null ? undefined : eq(applications.districtId, districtId)))
    .groupBy(applications.rateUnit);
  // The conversion is linear in rate × area, so the sum per unit converts once.
  const seedKg = seed.reduce((kg, s) => kg + (productKgApplied(Number(s.rateArea), s.rateUnit, 1) ?? 0), 0);
  return {
    hoursByCrew: byCrew.map((c) => ({ crewId: c.crewId, hours: Number(c.hours) })),
    hoursByEquipment: byEquipment.map((e) => ({ kind: e.kind as EquipmentKind, hours: Number(e.hours) })),
    nKg: Number(products?.nKg ?? 0),
    waterM3: Number(products?.waterM3 ?? 0),
    paintConcentrateL: Number(products?.paintL ?? 0),
    seedKg,
  };
}

export async function getBudget(ctx: Ctx, q: BudgetQuery): Promise<BudgetAnswer> {
  const districtId = budgetScope(ctx, q.districtId);
  const name = await scopeName(ctx.db, districtId, 'query.districtId');
  const { costs } = await readCosts(ctx.db);
  // The outlook the what-if starts from, kept until a table it reads is written.
  const { basis, outlooks } = await cachedSeasonOutlooks(ctx, q.season, districtId);
  const outlook = outlookBudgetFigures(outlooks, costs);
  const today = ctx.clock.today();
  const seasonEnd = `${q.season}-12-31`;
  const actualTo = today < seasonEnd ? today : seasonEnd;
  const use = await actualUse(ctx.db, districtId, `${q.season}-01-01`, actualTo, basis.params.irrigation.precipRateMmPerH);
  const actual = actualBudgetFigures(use, costs);
  const set = await ctx.db
    .select({ line: budgetLines.line, amount: budgetLines.amount, version: budgetLines.version })
    .from(budgetLines)
    .where(and(eq(budgetLines.season, q.season), districtId === null ? sql`${budgetLines.districtId} is null` : eq(budgetLines.districtId, districtId)));
  const lines = BUDGET_LINES.map((line) => {
    const row = set.find((s) => s.line === line);
    const facts = BUDGET_LINE_FACTS[line];
    return { line, label: facts.label, quantityUnit: facts.quantityUnit, money: facts.money, budget: row ? r2(row.amount) : null, version: row?.version ?? null, outlook: rounded(outlook[line]), actual: rounded(actual[line]) };
  });
  const money = lines.filter((l) => l.money);
  const note =
    basis.from === null
      ? `No weather on file for ${q.season}: the outlook has no days to work from yet.`
      : `The turf engine's outlook over ${basis.from} to ${basis.to} (the season's weather on file) for ${basis.inputs.length} fields${basis.withoutWeather ? `; ${basis.withoutWeather} without weather left out` : ''}. Fertiliser is each field's annual N in proportion to those days, so it is below the overview's feed plan, which counts the whole year. Seed: the outlook plans no overseeding.`;
  return {
    season: q.season,
    districtId,
    scopeName: name,
    currency: costs.currency,
    outlook: { from: basis.from, to: basis.to, fields: basis.inputs.length, note },
    actualTo,
    lines,
    totals: {
      budget: r2(money.reduce((s, l) => s + (l.budget ?? 0), 0)),
      outlook: r2(money.reduce((s, l) => s + (l.outlook.cost ?? 0), 0)),
      actual: r2(money.reduce((s, l) => s + (l.actual.cost ?? 0), 0)),
    },
  };
}

function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) if ((e as { code?: string }).code === '23505') return true;
  return false;
}

/** Sets (or clears, amount null) one line of a season's budget; audited; the version must be the one read. */
export async function setBudgetLine(ctx: Ctx, input: BudgetLineInput): Promise<{ line: BudgetLine; budget: number | null; version: number | null }> {
  const districtId = input.districtId;
  authorize(ctx, 'update', 'Budget', { districtId });
  await scopeName(ctx.db, districtId, 'body.districtId');
  const where = and(eq(budgetLines.season, input.season), eq(budgetLines.line, input.line), districtId === null ? sql`${budgetLines.districtId} is null` : eq(budgetLines.districtId, districtId));
  try {
    return await (ctx.db as Db).transaction(async (tx) => {
      const [before] = await tx.select().from(budgetLines).where(where);
      if ((before?.version ?? undefined) !== input.version) throw errors.versionConflict('budget_line');
      const audit = { actorId: ctx.actor.id, entity: 'budget_line', districtId };
      if (input.amount === null) {
        if (before) {
          await tx.delete(budgetLines).where(and(where, eq(budgetLines.version, before.version)));
          await writeAudit(tx, { ...audit, action: 'delete', entityId: before.id, before, after: null });
        }
        return { line: input.line, budget: null, version: null };
      }
      if (!before) {
        const [row] = await tx.insert(budgetLines).values({ season: input.season, districtId, line: input.line, amount: input.amount }).returning();
        await writeAudit(tx, { ...audit, action: 'create', entityId: row!.id, before: null, after: row! });
        return { line: input.line, budget: r2(row!.amount), version: row!.version };
      }
      const [row] = await tx
        .update(budgetLines)
        .set({ amount: input.amount, version: sql`${budgetLines.version} + 1`, updatedAt: new Date() })
        .where(and(where, eq(budgetLines.version, before.version)))
        .returning();
      if (!row) throw errors.versionConflict('budget_line');
      await writeAudit(tx, { ...audit, action: 'update', entityId: row.id, before, after: row });
      return { line: input.line, budget: r2(row.amount), version: row.version };
    });
  } catch (err) {
    // Two first saves of the same line at once: the second meets the unique key.
    if (isUniqueViolation(err)) throw errors.versionConflict('budget_line');
    throw err;
  }
}
