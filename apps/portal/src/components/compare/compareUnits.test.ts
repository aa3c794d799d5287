import { describe, expect, test } from 'vitest';
import { money, perLand } from './compareUnits.ts';

describe('compareUnits', () => {
  test('should show a per-acre figure per hectare in metric units', () => {
    // 1 ha = 10,000 m² / 4,046.8564224 m² per international acre = 2.4710538 ac (exact by definition of the acre).
    expect(perLand(100, 'metric')).toBeCloseTo(247.10538, 4);
    expect(perLand(100, 'imperial')).toBe(100);
    expect(perLand(null, 'metric')).toBeNull();
  });

  test('should write money in the department’s currency', () => {
    expect(money(1234.5, 'USD')).toBe('$1,235');
    expect(money(1234.5, 'USD', 2)).toBe('$1,234.50');
    expect(money(null, 'USD')).toBe('—');
  });
});
