import { describe, expect, it } from 'vitest';
import { cssToken, namedAxis } from './chartOptions.ts';

describe('chart options', () => {
  it('names an axis in the middle and keeps what the chart adds', () => {
    const style = { color: '#525a54', fontSize: 11 };
    expect(namedAxis('value', 'Cost (USD)', 60, style, { min: 0 })).toEqual({ type: 'value', name: 'Cost (USD)', nameLocation: 'middle', nameGap: 60, nameTextStyle: style, min: 0 });
    expect(namedAxis('category', 'Date', 26, style)).toEqual({ type: 'category', name: 'Date', nameLocation: 'middle', nameGap: 26, nameTextStyle: style });
  });

  it('reads a design token, or falls back when the page does not set it', () => {
    document.documentElement.style.setProperty('--sw-test-token', ' #123456 ');
    expect(cssToken('--sw-test-token', '#000')).toBe('#123456');
    expect(cssToken('--sw-not-set', '#abcdef')).toBe('#abcdef');
    document.documentElement.style.removeProperty('--sw-test-token');
  });
});
