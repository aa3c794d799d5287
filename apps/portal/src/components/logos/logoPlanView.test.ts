import { describe, expect, test } from 'vitest';
import { logoGrid, type FieldLogo } from '@swardwise/domain';
import { flipY, gridLines, logoTransform, templatePath } from './logoPlanView.ts';

describe('logoPlanView', () => {
  test('should flip y so the plan reads with the far side line on top', () => {
    expect(flipY(68)(0)).toBe(68);
    expect(flipY(68)(68)).toBe(0);
  });

  test('should turn the logo anticlockwise on screen for a positive rotation', () => {
    expect(logoTransform({ centerXM: 50, centerYM: 20, rotationDeg: 30 }, 68)).toBe('translate(50 48) rotate(-30)');
  });

  test('should draw one line per grid line from the reference corner', () => {
    const grid = logoGrid({ centerXM: 10, centerYM: 10, widthM: 4, heightM: 2, rotationDeg: 0 }, 1);
    const lines = gridLines({ grid } as Pick<FieldLogo, 'grid'>, 20);
    expect(lines).toHaveLength(5 + 3);
    expect(lines[0]).toEqual({ key: 'c0', x1: 8, y1: 11, x2: 8, y2: 9 });
  });

  test('should draw the sport’s layout for context and nothing for a lawn', () => {
    expect(templatePath('soccer', 105, 68)).toMatch(/^M0\.00 68\.00L/);
    expect(templatePath('lawn', 50, 30)).toBe('');
    // A youth pitch half the size gets the layout at half scale, inside its rectangle.
    const numbers = templatePath('soccer', 52.5, 34).match(/-?\d+\.\d+/g)!.map(Number);
    expect(Math.min(...numbers)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...numbers)).toBeLessThanOrEqual(52.5);
  });
});
