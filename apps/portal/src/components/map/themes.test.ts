import { describe, expect, test } from 'vitest';
import { MAP_THEMES, classify, isMapTheme, legendFor, styleFor, tally, type ThemedField } from './themes.ts';

const field = (over: Partial<ThemedField> = {}): ThemedField => ({ maintenanceLevel: 2, status: 'open', score: 72, daysSinceMowing: 5, overdue: false, ...over });
const resolve = (token: string) => `var(${token})`;

describe('map themes', () => {
  test('should give every theme a legend whose entries cover each class a field can fall in', () => {
    const samples = [
      field(),
      field({ maintenanceLevel: 1, score: 95, daysSinceMowing: 0, status: 'closed' }),
      field({ maintenanceLevel: 4, score: null, daysSinceMowing: null, overdue: null, status: 'restricted' }),
      field({ maintenanceLevel: 3, score: 10, daysSinceMowing: 40, overdue: true }),
    ];
    for (const { key } of MAP_THEMES) {
      const keys = legendFor(key).map((e) => e.key);
      for (const f of samples) expect(keys).toContain(classify(key, f));
    }
  });

  test('should band surface scores at 80, 65 and 50 and mark fields without a check', () => {
    expect(classify('score', field({ score: 80 }))).toBe('score-high');
    expect(classify('score', field({ score: 79.9 }))).toBe('score-good');
    expect(classify('score', field({ score: 65 }))).toBe('score-good');
    expect(classify('score', field({ score: 50 }))).toBe('score-fair');
    expect(classify('score', field({ score: 49 }))).toBe('score-low');
    expect(classify('score', field({ score: null }))).toBe('score-none');
  });

  test('should put overdue before the days since mowing and band the days otherwise', () => {
    expect(classify('mowing', field({ daysSinceMowing: 2, overdue: true }))).toBe('mow-overdue');
    expect(classify('mowing', field({ daysSinceMowing: 3 }))).toBe('mow-fresh');
    expect(classify('mowing', field({ daysSinceMowing: 4 }))).toBe('mow-week');
    expect(classify('mowing', field({ daysSinceMowing: 14 }))).toBe('mow-fortnight');
    expect(classify('mowing', field({ daysSinceMowing: 15 }))).toBe('mow-long');
    expect(classify('mowing', field({ daysSinceMowing: null, overdue: null }))).toBe('mow-none');
  });

  test('should colour by level and status tokens and dash closed and overdue fields', () => {
    expect(styleFor('level', field({ maintenanceLevel: 1 }), resolve).fillColor).toBe('var(--sw-level-1)');
    expect(styleFor('status', field({ status: 'restricted' }), resolve).fillColor).toBe('var(--sw-status-restricted)');
    expect(styleFor('status', field({ status: 'closed' }), resolve).dashArray).toBeDefined();
    expect(styleFor('status', field({ status: 'open' }), resolve).dashArray).toBeUndefined();
    expect(styleFor('status', field({ status: 'retired' }), resolve)).toMatchObject({ fillColor: 'var(--sw-status-retired)', dashArray: '5 4' });
    expect(styleFor('mowing', field({ overdue: true }), resolve).dashArray).toBeDefined();
    expect(styleFor('level', field(), resolve, true).weight).toBeGreaterThan(styleFor('level', field(), resolve).weight);
  });

  test('should count fields per legend entry, zero for empty entries', () => {
    const counts = tally('status', [field(), field({ status: 'closed' }), field()]);
    expect(counts).toEqual({ 'status-open': 2, 'status-restricted': 0, 'status-closed': 1, 'status-retired': 0 });
  });

  test('should accept only known theme names from the address', () => {
    expect(isMapTheme('score')).toBe(true);
    expect(isMapTheme('heat')).toBe(false);
    expect(isMapTheme(undefined)).toBe(false);
  });
});
