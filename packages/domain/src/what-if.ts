/**
 * What-if: the change a scenario (fields moved to other levels, a level's Standards changed)
 * makes to the season, before anything is saved. The change is outlook(after) − outlook(before),
 * each worked out by the turf engine's own `fieldOutlook`; only the fields the scenario touches
 * are worked out again, since the others' outlooks are the same on both sides.
 */
import { BUDGET_LINES, outlookBudgetFigures, type BudgetFigures } from './budget.ts';
import { aggregateOutlooks, fieldOutlook, type FieldOutlook, type OutlookField, type OutlookOptions, type OutlookTotals, type PreparedWeather } from './engine/outlook.ts';
import type { DepartmentParameters, LevelStandard, Standards } from './engine/standards.ts';
import type { CostSettings } from './schemas/costs.ts';
import type { Level } from './vocabulary.ts';


/** A scenario: fields moved to a level, and changes to levels' Standards (the keys named replace the stored ones). */
export interface WhatIfScenario {
  moves: ReadonlyArray<{ fieldId: string | number; level: Level }>;
  standards?: Partial<Record<Level, Partial<Omit<LevelStandard, 'level' | 'name'>>>>;
}

export interface WhatIfField {
  field: OutlookField;
  weather: PreparedWeather;
}

export interface WhatIfSide {
  totals: OutlookTotals;
  /** The totals as budget lines priced with the cost settings. */
  lines: BudgetFigures;
}

export interface WhatIfResult {
  before: WhatIfSide;
  after: WhatIfSide;
  /** after − before, line by line. */
  delta: WhatIfSide;
  /** Per district (by `districtId`): before, after and the change. */
  byDistrict: Record<string, { before: OutlookTotals; after: OutlookTotals; delta: OutlookTotals }>;
  /** Fields whose outlook the scenario changes inputs of (moved, or at a level whose Standards change). */
  fieldsTouched: number;
}

/** The Standards with a scenario's changes applied (a level's nested HOC tables replaced whole when named). */
export function scenarioStandards(standards: Standards, scenario: WhatIfScenario): Standards {
  if (!scenario.standards) return standards;
  const out = { ...standards };
  for (const [key, change] of Object.entries(scenario.standards) as [string, Partial<LevelStandard> | undefined][]) {
    const level = Number(key) as Level;
    if (!change || !out[level]) continue;
    out[level] = { ...out[level], ...change, level };
  }
  return out;
}

function subtract(a: OutlookTotals, b: OutlookTotals): OutlookTotals {
  const c = (k: keyof OutlookTotals['cost']) => a.cost[k] - b.cost[k];
  return {
    fields: a.fields - b.fields,
    areaM2: a.areaM2 - b.areaM2,
    mowings: a.mowings - b.mowings,
    mowingHours: a.mowingHours - b.mowingHours,
    lineHours: a.lineHours - b.lineHours,
    labourHours: a.labourHours - b.labourHours,
    nKg: a.nKg - b.nKg,
    productKg: a.productKg - b.productKg,
    waterM3: a.waterM3 - b.waterM3,
    paintMixedL: a.paintMixedL - b.paintMixedL,
    paintConcentrateL: a.paintConcentrateL - b.paintConcentrateL,
    cost: { labour: c('labour'), water: c('water'), paint: c('paint'), fertiliser: c('fertiliser'), total: c('total') },
  };
}

function subtractLines(a: BudgetFigures, b: BudgetFigures): BudgetFigures {
  const out = {} as BudgetFigures;
  for (const l of BUDGET_LINES) {
    const x = a[l];
    const y = b[l];
    out[l] = { quantity: x.quantity - y.quantity, cost: x.cost === null || y.cost === null ? null : x.cost - y.cost };
  }
  return out;
}

/**
 * The season before and after a scenario, and the change, for a set of fields each with its
 * weather. `before` may pass outlooks already worked out with the same inputs (in the order
 * of `fields`), so a page that shows the season need not work them out twice.
 */
export function whatIf(
  fields: readonly WhatIfField[],
  standards: Standards,
  params: DepartmentParameters,
  costs: CostSettings,
  scenario: WhatIfScenario,
  options: OutlookOptions = {},
  before: readonly FieldOutlook[] = fields.map((f) => fieldOutlook(f.field, f.weather, standards, params, options)),
): WhatIfResult {
  const moved = new Map(scenario.moves.map((m) => [String(m.fieldId), m.level]));
  const changedLevels = new Set(Object.keys(scenario.standards ?? {}).map(Number));
  const afterStandards = scenarioStandards(standards, scenario);
  let touched = 0;
  const after = fields.map((f, i) => {
    const level = moved.get(String(f.field.id)) ?? f.field.maintenanceLevel;
    if (level === f.field.maintenanceLevel && !changedLevels.has(level)) return before[i]!;
    touched++;
    return fieldOutlook({ ...f.field, maintenanceLevel: level }, f.weather, afterStandards, params, options);
  });
  const b = aggregateOutlooks(before);
  const a = aggregateOutlooks(after);
  const byDistrict: WhatIfResult['byDistrict'] = {};
  for (const key of new Set([...Object.keys(b.byDistrict), ...Object.keys(a.byDistrict)])) {
    const x = b.byDistrict[key]!;
    const y = a.byDistrict[key]!;
    byDistrict[key] = { before: x, after: y, delta: subtract(y, x) };
  }
  const beforeLines = outlookBudgetFigures(before, costs);
  const afterLines = outlookBudgetFigures(after, costs);
  return {
    before: { totals: b.department, lines: beforeLines },
    after: { totals: a.department, lines: afterLines },
    delta: { totals: subtract(a.department, b.department), lines: subtractLines(afterLines, beforeLines) },
    byDistrict,
    fieldsTouched: touched,
  };
}
