/** The season budget as `GET /api/budget` answers it. */
import type { BudgetFigure, BudgetLine } from '../budget.ts';
import type { WhatIfInput } from '../schemas/budget.ts';
import type { WhatIfResult } from '../what-if.ts';
import type { Instant } from './common.ts';

export interface BudgetLineRow {
  line: BudgetLine;
  label: string;
  /** Unit of the quantities (h, L, kg N, m³, L concentrate, kg). */
  quantityUnit: string;
  /** True when the budget and costs are money; false for equipment hours (budget in h). */
  money: boolean;
  /** What the head set, in the currency (money lines) or hours; null when not set. */
  budget: number | null;
  /** The row's version, for the next change; null when never set. */
  version: number | null;
  outlook: BudgetFigure;
  actual: BudgetFigure;
}

export interface BudgetAnswer {
  season: number;
  /** Null: the department's budget (every district). */
  districtId: number | null;
  scopeName: string;
  currency: string;
  /** The outlook's weather: the first and last day of the season with weather, and how many fields it covers. */
  outlook: { from: string | null; to: string | null; fields: number; note: string };
  /** The actual counts done work up to this department date. */
  actualTo: string;
  lines: BudgetLineRow[];
  totals: { budget: number; outlook: number; actual: number };
}

/** `POST /api/what-if`: the season before and after the scenario, and the change (figures rounded). */
export interface WhatIfAnswer {
  season: number;
  districtId: number | null;
  scopeName: string;
  currency: string;
  result: WhatIfResult;
}

/** A saved what-if: the change as it was asked for, and who saved it. */
export interface WhatIfScenarioRow<At extends Instant = string> {
  id: number;
  name: string;
  season: number;
  /** Null: the department's (every district). */
  districtId: number | null;
  scopeName: string;
  change: WhatIfInput;
  createdBy: number | null;
  createdByName: string | null;
  createdAt: At;
  /** The caller saved it (and so may delete it). */
  mine: boolean;
}

/** `GET /api/what-if/scenarios`, newest first. */
export interface WhatIfScenarioList<At extends Instant = string> {
  items: WhatIfScenarioRow<At>[];
}

/** `GET /api/what-if/scenarios/compare`: each scenario with its change against today's outlook, in the order asked. */
export interface WhatIfCompareAnswer<At extends Instant = string> {
  items: Array<{ scenario: WhatIfScenarioRow<At>; answer: WhatIfAnswer }>;
}
