/**
 * What-if previews: the season's change in mowings, hours, inputs and cost if fields moved to
 * other levels or a level's Standards changed, worked out by the engine and priced with the
 * cost settings. A preview saves nothing; a saved scenario keeps the change, never its result,
 * so comparing scenarios works each out again against the outlook of the day.
 */
import { and, desc, eq, inArray, type SQL } from 'drizzle-orm';
import {
  errors,
  whatIf,
  type Level,
  type WhatIfAnswer,
  type WhatIfCompareAnswer,
  type WhatIfInput,
  type WhatIfResult,
  type WhatIfScenario,
  type WhatIfScenarioInput,
  type WhatIfScenarioList,
  type WhatIfScenarioRow,
} from '@swardwise/domain';
import { districts, fields, sites, users, whatIfScenarios } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { budgetScope } from './budget.ts';
import { authorize, can, type Ctx } from './context.ts';
import { readCosts } from './costs.ts';
import { cachedSeasonOutlooks } from './season-outlook.ts';

/** Every number of an answer rounded to 3 decimals, so the JSON stays short. */
function rounded<T>(v: T): T {
  if (typeof v === 'number') return (Math.round(v * 1000) / 1000) as T;
  if (v && typeof v === 'object') return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, rounded(x)])) as T;
  return v;
}

/**
 * The season before and after a change. `skipGone` leaves out moves of fields that no longer
 * exist in the scope (a saved scenario read after a field was removed) instead of refusing them.
 */
export async function previewWhatIf(ctx: Ctx, input: WhatIfInput, { skipGone = false } = {}): Promise<WhatIfAnswer> {
  const districtId = budgetScope(ctx, input.districtId);
  const { basis, outlooks } = await cachedSeasonOutlooks(ctx, input.season, districtId);
  const known = new Set(basis.inputs.map((i) => i.field.id));
  if (skipGone) input = { ...input, moves: input.moves.filter((m) => known.has(m.fieldId)) };
  const missing = input.moves.map((m, i) => ({ ...m, i })).filter((m) => !known.has(m.fieldId));
  if (missing.length) {
    // A field of another district is refused as the district would be; one that does not exist (or has no weather) is a bad input.
    const found = await ctx.db.select({ id: fields.id, districtId: sites.districtId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(inArray(fields.id, missing.map((m) => m.fieldId)));
    for (const f of found) if (!can(ctx, 'read', 'Budget', { districtId: f.districtId }) || (districtId !== null && f.districtId !== districtId)) throw errors.forbidden('That field is outside the district of this what-if');
    throw errors.noSuch('field with weather in this season', `body.moves.${missing[0]!.i}.fieldId`);
  }
  const { costs } = await readCosts(ctx.db);
  const scenario: WhatIfScenario = {
    moves: input.moves.map((m) => ({ fieldId: m.fieldId, level: m.level as Level })),
    standards: Object.fromEntries(Object.entries(input.standards ?? {}).map(([k, v]) => [Number(k), v])),
  };
  const result: WhatIfResult = whatIf(basis.inputs, basis.standards, basis.params, costs, scenario, {}, outlooks);
  const [scope] = districtId === null ? [{ name: 'Department' }] : await ctx.db.select({ name: districts.name }).from(districts).where(eq(districts.id, districtId));
  if (!scope) throw errors.noSuch('district', 'body.districtId');
  return { season: input.season, districtId, scopeName: scope.name, currency: costs.currency, result: rounded(result) };
}

const scenarioColumns = {
  id: whatIfScenarios.id,
  name: whatIfScenarios.name,
  season: whatIfScenarios.season,
  districtId: whatIfScenarios.districtId,
  districtName: districts.name,
  change: whatIfScenarios.change,
  createdBy: whatIfScenarios.createdBy,
  createdByName: users.name,
  createdAt: whatIfScenarios.createdAt,
};

async function readScenarios(ctx: Ctx, where: SQL | undefined): Promise<WhatIfScenarioRow<Date>[]> {
  const rows = await ctx.db
    .select(scenarioColumns)
    .from(whatIfScenarios)
    .leftJoin(districts, eq(districts.id, whatIfScenarios.districtId))
    .leftJoin(users, eq(users.id, whatIfScenarios.createdBy))
    .where(where)
    .orderBy(desc(whatIfScenarios.id));
  return rows.map(({ districtName, ...r }) => ({ ...r, scopeName: r.districtId === null ? 'Department' : (districtName ?? ''), mine: r.createdBy === ctx.actor.id }));
}

/** Rows a foreman may never see: another district's and the department's. */
function scopeFilter(ctx: Ctx): SQL | undefined {
  return ctx.actor.role === 'foreman' ? eq(whatIfScenarios.districtId, ctx.actor.districtId ?? -1) : undefined;
}

/** `GET /api/what-if/scenarios`: the saved scenarios the caller may read, newest first. */
export async function listScenarios(ctx: Ctx, query: { season?: number | undefined }): Promise<WhatIfScenarioList<Date>> {
  authorize(ctx, 'read', 'WhatIfScenario');
  const items = await readScenarios(ctx, and(scopeFilter(ctx), query.season === undefined ? undefined : eq(whatIfScenarios.season, query.season)));
  return { items: items.filter((r) => can(ctx, 'read', 'WhatIfScenario', r)) };
}

/**
 * `POST /api/what-if/scenarios`: the change saved under a name. Its scope is the change's
 * district (a foreman's own when he names none); every moved field must be in that scope.
 */
export async function createScenario(ctx: Ctx, input: WhatIfScenarioInput): Promise<WhatIfScenarioRow<Date>> {
  const districtId = input.change.districtId ?? (ctx.actor.role === 'foreman' ? ctx.actor.districtId : null);
  authorize(ctx, 'create', 'WhatIfScenario', { districtId });
  const ids = [...new Set(input.change.moves.map((m) => m.fieldId))];
  if (ids.length) {
    const found = await ctx.db.select({ id: fields.id, districtId: sites.districtId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(inArray(fields.id, ids));
    if (found.some((f) => districtId !== null && f.districtId !== districtId)) throw errors.forbidden('That field is outside the district of this what-if');
    const known = new Set(found.map((f) => f.id));
    const i = input.change.moves.findIndex((m) => !known.has(m.fieldId));
    if (i >= 0) throw errors.noSuch('field', `body.change.moves.${i}.fieldId`);
  }
  if (districtId !== null) {
    const [d] = await ctx.db.select({ id: districts.id }).from(districts).where(eq(districts.id, districtId));
    if (!d) throw errors.noSuch('district', 'body.change.districtId');
  }
  const change: WhatIfInput = { ...input.change, ...(districtId === null ? {} : { districtId }) };
  const id = await ctx.db.transaction(async (tx) => {
    const [row] = await tx.insert(whatIfScenarios).values({ name: input.name, season: change.season, districtId, change, createdBy: ctx.actor.id }).returning();
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'what_if_scenario', entityId: row!.id, districtId, before: null, after: row! });
    return row!.id;
  });
  return (await readScenarios(ctx, eq(whatIfScenarios.id, id)))[0]!;
}

/** A saved scenario the caller may read: missing, or another district's for a foreman, is 404 (he never learns it exists). */
async function readableScenario(ctx: Ctx, id: number): Promise<WhatIfScenarioRow<Date>> {
  const [row] = await readScenarios(ctx, eq(whatIfScenarios.id, id));
  if (!row || !can(ctx, 'read', 'WhatIfScenario', row)) throw errors.notFound('what_if_scenario', id);
  return row;
}

/** `DELETE /api/what-if/scenarios/:id`: only the one who saved it removes it. */
export async function deleteScenario(ctx: Ctx, id: number): Promise<void> {
  const row = await readableScenario(ctx, id);
  authorize(ctx, 'delete', 'WhatIfScenario', row);
  await ctx.db.transaction(async (tx) => {
    await tx.delete(whatIfScenarios).where(eq(whatIfScenarios.id, id));
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'delete', entity: 'what_if_scenario', entityId: id, districtId: row.districtId, before: { id: row.id, name: row.name, season: row.season, change: row.change }, after: null });
  });
}

/** `GET /api/what-if/scenarios/compare`: each scenario's change against today's outlook, in the order asked. */
export async function compareScenarios(ctx: Ctx, ids: readonly number[]): Promise<WhatIfCompareAnswer<Date>> {
  authorize(ctx, 'read', 'WhatIfScenario');
  const rows = [];
  for (const id of ids) rows.push(await readableScenario(ctx, id));
  const items = [];
  for (const scenario of rows) items.push({ scenario, answer: await previewWhatIf(ctx, scenario.change, { skipGone: true }) });
  return { items };
}
