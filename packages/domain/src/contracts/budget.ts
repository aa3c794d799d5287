/** The season budget as `GET /api/budget` answers it. */
import type { BudgetFigure, BudgetLine } from '../budget.ts';
import type { WhatIfResult } from '../what-if.ts';

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
