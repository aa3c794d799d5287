import { describe, expect, test } from 'vitest';
import { greatCircleKm } from '@swardwise/domain';
import { nearestStation, unbrokenRunAround } from './stations.ts';

const days = (...dates: string[]) => dates.map((date) => ({ date }));

describe('nearestStation', () => {
  const field = { lat: 40.0, lng: -75.0 };
  const stations = [
    { id: 1, lat: 40.5, lng: -75.0 },
    { id: 2, lat: 40.1, lng: -75.1 },
    { id: 3, lat: 39.0, lng: -74.0 },
  ];

  test('should pick the station nearest by great-circle distance and give that distance', () => {
    const best = nearestStation(stations, field);
    expect(best?.id).toBe(2);
    expect(best?.distanceKm).toBe(greatCircleKm(field, stations[1]!));
  });

  test('should let the first listed station win a tie', () => {
    const twins = [
      { id: 7, lat: 40.1, lng: -75.0 },
      { id: 8, lat: 40.1, lng: -75.0 },
    ];
    expect(nearestStation(twins, field)?.id).toBe(7);
  });

  test('should give nothing when no station has weather', () => {
    expect(nearestStation([], field)).toBeUndefined();
  });
});

describe('unbrokenRunAround', () => {
  const rows = days('2026-05-01', '2026-05-02', '2026-05-04', '2026-05-05', '2026-05-06', '2026-05-09');

  test('should keep the days that follow one another on both sides of the day', () => {
    expect(unbrokenRunAround(rows, 3).map((d) => d.date)).toEqual(['2026-05-04', '2026-05-05', '2026-05-06']);
  });

  test('should stop at a gap at either end of the list', () => {
    expect(unbrokenRunAround(rows, 0).map((d) => d.date)).toEqual(['2026-05-01', '2026-05-02']);
    expect(unbrokenRunAround(rows, rows.length - 1).map((d) => d.date)).toEqual(['2026-05-09']);
  });

  test('should run across a month end', () => {
    expect(unbrokenRunAround(days('2026-04-29', '2026-04-30', '2026-05-01'), 2)).toHaveLength(3);
  });

  test('should give an empty run for an empty list', () => {
    expect(unbrokenRunAround([], -1)).toEqual([]);
  });
});
