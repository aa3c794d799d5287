/**
 * What-if previews: the season's change in mowings, hours, inputs and cost if fields moved to
 * other levels or a level's Standards changed, worked out by the engine and priced with the
 * cost settings. Nothing is saved.
 */
import { inArray, eq } from 'drizzle-orm';
import { errors, whatIf, type Level, type WhatIfAnswer, type WhatIfInput, type WhatIfResult, type WhatIfScenario } from '@swardwise/domain';
import { districts, fields, sites } from '../db/schema/index.ts';
import { budgetScope } from './budget.ts';
import { can, type Ctx } from './context.ts';
import { readCosts } from './costs.ts';
import { loadSeasonBasis } from './season-outlook.ts';

/** Every number of an answer rounded to 3 decimals, so the JSON stays short. */
function rounded<T>(v: T): T {
  if (typeof v === 'number') return (Math.round(v * 1000) / 1000) as T;
  if (v && typeof v === 'object') return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, rounded(x)])) as T;
  return v;
}

export async function previewWhatIf(ctx: Ctx, input: WhatIfInput): Promise<WhatIfAnswer> {
  const districtId = budgetScope(ctx, input.districtId);
  const basis = await loadSeasonBasis(ctx.db, input.season, districtId === null ? {} : { districtId });
  const known = new Set(basis.inputs.map((i) => i.field.id));
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
  const result: WhatIfResult = whatIf(basis.inputs, basis.standards, basis.params, costs, scenario);
  const [scope] = districtId === null ? [{ name: 'Department' }] : await ctx.db.select({ name: districts.name }).from(districts).where(eq(districts.id, districtId));
  if (!scope) throw errors.noSuch('district', 'body.districtId');
  return { season: input.season, districtId, scopeName: scope.name, currency: costs.currency, result: rounded(result) };
}
