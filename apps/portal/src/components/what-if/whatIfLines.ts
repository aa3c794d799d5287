/**
 * A what-if answer as the rows a turf manager reads: mowings, hours and each input for the
 * season before and after the change, and the change, in the user's units; cost per line.
 */
import { BUDGET_LINE_FACTS, type BudgetLine, type UnitSystem, type WhatIfInput, type WhatIfResult } from '@swardwise/domain';
import { moneyText, quantityInUnits, quantityText, signedMoneyText, signedQuantityText } from '../budget/budgetView.ts';
import { changesWords } from './whatIfStandards.ts';

export interface WhatIfRow {
  key: 'mowings' | BudgetLine | 'total';
  label: string;
  before: string;
  after: string;
  change: string;
  costBefore: string;
  costAfter: string;
  costChange: string;
  /** The change in the currency (null: not a money line), for the chart. */
  costDelta: number | null;
}

const LINE_LABELS: Record<BudgetLine, string> = {
  labour: 'Labour hours',
  fuel: 'Fuel',
  fertiliser: 'Fertiliser (N)',
  water: 'Water',
  paint: 'Line paint (concentrate)',
  seed: 'Seed',
  equipment: 'Machine hours',
};

const LINE_ORDER: BudgetLine[] = ['labour', 'equipment', 'fuel', 'fertiliser', 'water', 'paint', 'seed'];

const count = (n: number) => Math.round(n).toLocaleString('en-US');
const signedCount = (n: number) => (Math.round(n) === 0 ? 'no change' : `${n > 0 ? '+' : '−'}${count(Math.abs(n))}`);

export function whatIfRows(r: WhatIfResult, currency: string, units: UnitSystem): WhatIfRow[] {
  const money = (v: number | null) => moneyText(v, currency);
  const rows: WhatIfRow[] = [
    {
      key: 'mowings',
      label: 'Mowings',
      before: count(r.before.totals.mowings),
      after: count(r.after.totals.mowings),
      change: signedCount(r.delta.totals.mowings),
      costBefore: '',
      costAfter: '',
      costChange: '',
      costDelta: null,
    },
  ];
  for (const line of LINE_ORDER) {
    // The label says concentrate; the unit stays short so the table fits.
    const unit = line === 'paint' ? 'L' : BUDGET_LINE_FACTS[line].quantityUnit;
    const q = (v: number) => quantityText(v, { quantityUnit: unit }, units);
    const b = r.before.lines[line];
    const a = r.after.lines[line];
    const d = r.delta.lines[line];
    rows.push({
      key: line,
      label: LINE_LABELS[line],
      before: q(b.quantity),
      after: q(a.quantity),
      change: signedQuantityText(d.quantity, unit, units),
      costBefore: b.cost === null ? '' : money(b.cost),
      costAfter: a.cost === null ? '' : money(a.cost),
      costChange: d.cost === null ? '' : signedMoneyText(d.cost, currency),
      costDelta: d.cost,
    });
  }
  const total = (side: WhatIfResult['before']) => LINE_ORDER.reduce((s, l) => s + (side.lines[l].cost ?? 0), 0);
  rows.push({ key: 'total', label: 'Total cost', before: '', after: '', change: '', costBefore: money(total(r.before)), costAfter: money(total(r.after)), costChange: signedMoneyText(total(r.delta), currency), costDelta: total(r.delta) });
  return rows;
}

/** A line's quantity change as a number in the user's units, with its unit, for a chart's tooltip. */
export function changeInUnits(r: WhatIfResult, line: BudgetLine, units: UnitSystem) {
  return quantityInUnits(r.delta.lines[line].quantity, BUDGET_LINE_FACTS[line].quantityUnit, units);
}

/** What a saved change holds, in words ("3 fields to level 4", "Level 2: least mowings per week: 3"). */
export function changeSummary(change: WhatIfInput): string[] {
  const byLevel = new Map<number, number>();
  for (const m of change.moves) byLevel.set(m.level, (byLevel.get(m.level) ?? 0) + 1);
  const moves = [...byLevel.entries()].sort((a, b) => a[0] - b[0]).map(([level, n]) => `${n.toLocaleString('en-US')} ${n === 1 ? 'field' : 'fields'} to level ${level}`);
  return [...moves, ...changesWords(change.standards)];
}
