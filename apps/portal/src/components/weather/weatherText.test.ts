import { describe, expect, test } from 'vitest';
import { weatherGapText } from './weatherText.ts';

describe('weatherGapText', () => {
  test('should say since when weather is missing and how many days', () => {
    expect(weatherGapText({ since: '2026-11-28', through: '2026-12-03', days: 6 }, 'Riverside')).toBe(
      'No weather from Riverside since Fri, Nov 27, 2026: the 6 days from Sat, Nov 28, 2026 to today have none on file (the weather service may be down, or a station file is due). Figures rest on the last weather on file.',
    );
  });

  test('should speak of today alone when only today is missing', () => {
    expect(weatherGapText({ since: '2026-12-03', through: '2026-12-03', days: 1 }, 'Riverside')).toContain(': today has none on file');
  });
});
