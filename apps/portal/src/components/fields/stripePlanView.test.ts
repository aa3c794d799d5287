import { describe, expect, test } from 'vitest';
import { stripePlan } from '@swardwise/domain';
import { lengthText, passesText, planDescription, planFacts, scaleBar } from './stripePlanView.ts';

const rect: Array<[number, number]> = [[0, 0], [100, 0], [100, 60], [0, 60]];
const mower = { widthM: 2, overlapM: 0, speedKmh: 6, efficiency: 0.8, turnTimeS: 16 };

describe('stripePlanView', () => {
  test('should word a checkerboard’s passes by direction and its time in h:mm', () => {
    const plan = stripePlan(rect, 'checkerboard', mower);
    expect(passesText(plan)).toBe('30 length-wise + 50 side-to-side');
    const facts = Object.fromEntries(planFacts(plan, mower, 'metric').map((f) => [f.label, f.value]));
    expect(facts.Passes).toBe('80 (30 length-wise + 50 side-to-side)');
    // 6 km ÷ 4.8 km/h = 1.25 h; 78 turns × 16 s = 1248 s = 0.3467 h; 1.5967 h = 95.8 min = 1:36.
    expect(facts.Time).toBe('1:36 h');
    expect(facts['Distance driven']).toBe('6.0 km');
  });

  test('should give lengths and the scale bar in the person’s units', () => {
    expect(lengthText(100, 'metric')).toBe('100 m');
    expect(lengthText(100, 'imperial')).toBe('328 ft');
    expect(scaleBar('imperial')).toEqual({ lengthM: 18.288, label: '20 yd' });
    expect(planDescription('Soccer 1', stripePlan(rect, 'diagonal', mower), 100, 60, 'metric')).toMatch(/^Diagonal stripes on Soccer 1, drawn to scale with the long axis \(100 m\)/);
  });
});
