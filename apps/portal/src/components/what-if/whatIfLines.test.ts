import { describe, expect, test } from 'vitest';
import { BUDGET_LINES, type BudgetFigures, type OutlookTotals, type WhatIfResult } from '@swardwise/domain';
import { signedQuantityText, quantityText } from '../budget/budgetView.ts';
import { whatIfRows } from './whatIfLines.ts';
import { changesWords, draftToChanges } from './whatIfStandards.ts';

function lines(f: (line: string) => { quantity: number; cost: number | null }): BudgetFigures {
  return Object.fromEntries(BUDGET_LINES.map((l) => [l, f(l)])) as BudgetFigures;
}
const totals = (mowings: number) => ({ mowings }) as OutlookTotals;

describe('whatIfRows', () => {
  const result = {
    before: { totals: totals(1200), lines: lines((l) => ({ quantity: l === 'water' ? 10_000 : 2000.33, cost: l === 'equipment' ? null : 1000 })) },
    after: { totals: totals(950), lines: lines((l) => ({ quantity: l === 'water' ? 9000 : 1800, cost: l === 'equipment' ? null : 900 })) },
    delta: { totals: totals(-250), lines: lines((l) => ({ quantity: l === 'water' ? -1000 : -200.33, cost: l === 'equipment' ? null : -100 })) },
    byDistrict: {},
    fieldsTouched: 3,
  } as unknown as WhatIfResult;

  test('should show mowings, season hours as whole hours and water in thousand gallons with signed changes', () => {
    const rows = whatIfRows(result, 'USD', 'imperial');
    const row = (k: string) => rows.find((r) => r.key === k)!;
    expect(row('mowings')).toMatchObject({ before: '1,200', after: '950', change: '−250' });
    expect(row('equipment')).toMatchObject({ before: '2,000 h', change: '−200 h', costChange: '' });
    // 10,000 m³ ÷ 3.785411784 m³ per thousand US gallons (exact definition of the gallon) = 2,641.7.
    expect(row('water').before).toBe('2,642 thousand gal');
    expect(row('labour')).toMatchObject({ costBefore: '$1,000', costChange: '−$100' });
    // Six money lines at −$100 each.
    expect(row('total')).toMatchObject({ costBefore: '$6,000', costAfter: '$5,400', costChange: '−$600' });
  });

  test('should write metric quantities and no change plainly', () => {
    expect(quantityText(10_580, { quantityUnit: 'm³' }, 'metric')).toBe('10,580 m³');
    expect(signedQuantityText(0.01, 'kg N', 'metric')).toBe('no change');
    expect(signedQuantityText(12.34, 'kg N', 'metric')).toBe('+12.3 kg N');
  });
});

describe('what-if Standards draft', () => {
  test('should send percent as shares, leave blanks out and word the changes', () => {
    const changes = draftToChanges({ 1: {}, 2: { minMowingsPerWeek: 3, annualNShare: 85, lineRepaintDays: undefined }, 3: {}, 4: {} });
    expect(changes).toEqual({ 2: { minMowingsPerWeek: 3, annualNShare: 0.85 } });
    expect(changesWords(changes)).toEqual(['Level 2: least mowings per week: 3; feed share of upper annual N: 85 %']);
  });
});
