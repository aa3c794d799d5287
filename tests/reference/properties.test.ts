/** Properties of the engine checked with fast-check over generated inputs. */
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import * as e from '@swardwise/domain/engine';

const mower = e.DEFAULT_PARAMETERS.mowers.rotary;

describe('engine properties', () => {
  test('should give the same daily ET0 on the season path as the full FAO-56 computation, and the same refusals', () => {
    const opt = <T>(a: fc.Arbitrary<T>) => fc.option(a, { nil: undefined });
    fc.assert(
      fc.property(
        fc.double({ min: -89.9, max: 89.9, noNaN: true }),
        fc.double({ min: -100, max: 3000, noNaN: true }),
        fc.boolean(),
        fc.integer({ min: 1, max: 366 }),
        fc.double({ min: -30, max: 45, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.record({ tdewC: opt(fc.double({ min: -40, max: 50, noNaN: true })), rhMaxPct: opt(fc.double({ min: -5, max: 105, noNaN: true })), rhMinPct: opt(fc.double({ min: 0, max: 100, noNaN: true })), rhMeanPct: opt(fc.double({ min: 0, max: 100, noNaN: true })), windMs: opt(fc.double({ min: 0, max: 12, noNaN: true })), windHeightM: opt(fc.double({ min: 0.2, max: 20, noNaN: true })), sunshineH: opt(fc.double({ min: 0, max: 24, noNaN: true })), solarMJ: opt(fc.double({ min: 0, max: 40, noNaN: true })) }),
        (latDeg, elevationM, coastal, doy, tmin, range, extra) => {
          const day = { tmaxC: tmin + range, tminC: tmin, ...extra };
          let full: number | Error;
          try {
            full = e.et0PenmanMonteith({ ...day, latDeg, elevationM, doy, coastal }).et0Mm;
          } catch (err) {
            full = err as Error;
          }
          const station = e.et0Station(latDeg, elevationM, coastal);
          if (full instanceof Error) expect(() => e.et0PenmanMonteithDay(station, doy, day)).toThrow(full.message);
          else expect(e.et0PenmanMonteithDay(station, doy, day)).toBeCloseTo(full, 12);
        },
      ),
      { numRuns: 2000 },
    );
    // Days at the edges of the checks refuse alike on both paths.
    const station = e.et0Station(45, 100);
    for (const bad of [{ rhMaxPct: 100.5 }, { rhMaxPct: 60, rhMinPct: 70 }, { rhMeanPct: -1 }, { tdewC: 31 }, { windMs: -0.1 }, { windMs: 2, windHeightM: 0.4 }, { sunshineH: 16 }, { solarMJ: -1 }]) {
      const day = { tmaxC: 30, tminC: 15, ...bad };
      expect(() => e.et0PenmanMonteith({ ...day, latDeg: 45, elevationM: 100, doy: 172 })).toThrow();
      expect(() => e.et0PenmanMonteithDay(station, 172, day)).toThrow();
    }
  });

  test('should mow at least as often when the temperature is nearer the optimum', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 20, noNaN: true }), fc.double({ min: 5, max: 20, noNaN: true }), fc.integer({ min: 20, max: 80 }), (a, b, hoc) => {
        const [far, near] = a <= b ? [a, b] : [b, a];
        const run = (t: number) => e.simulateMowing(hoc, new Array(120).fill(e.dailyGrowthMm(5, t, 'cool')), hoc, { startDate: '2025-04-01' });
        const farSim = run(far);
        const nearSim = run(near);
        expect(nearSim.mowings.length).toBeGreaterThanOrEqual(farSim.mowings.length);
        if (farSim.meanIntervalDays !== null && nearSim.meanIntervalDays !== null) expect(nearSim.meanIntervalDays).toBeLessThanOrEqual(farSim.meanIntervalDays);
      }),
    );
  });

  test('should never need fewer mowing hours for a larger area', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 200_000, noNaN: true }), fc.double({ min: 0, max: 200_000, noNaN: true }), (a, b) => {
        const [small, large] = a <= b ? [a, b] : [b, a];
        expect(e.hoursPerMowing(large, mower)).toBeGreaterThanOrEqual(e.hoursPerMowing(small, mower));
      }),
    );
    fc.assert(
      fc.property(fc.double({ min: 20, max: 150, noNaN: true }), fc.double({ min: 20, max: 100, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }), (l, w, extra) => {
        for (const dir of ['lengthwise', 'side_to_side', 'criss_cross'] as const) {
          expect(e.stripePassPlan(l + extra, w, mower, dir).hours).toBeGreaterThanOrEqual(e.stripePassPlan(l, w, mower, dir).hours - 1e-12);
        }
      }),
    );
  });

  test('should never put more N in one application than the limit, and keep the total', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 30, noNaN: true }), { minLength: 12, maxLength: 12 }), fc.double({ min: 0, max: 1, noNaN: true }), (monthly, slow) => {
        const apps = e.planNApplications(monthly, { slowReleaseShare: slow, year: 2025 });
        const limit = e.maxNPerApplication(slow);
        for (const a of apps) {
          expect(a.nGPerM2).toBeLessThanOrEqual(limit + 1e-9);
          expect(a.nGPerM2 * (1 - slow)).toBeLessThanOrEqual(e.DEFAULT_PARAMETERS.solubleNLimitGPerM2 + 1e-9);
        }
        const planned = monthly.filter((n) => n > 1e-9).reduce((s, n) => s + n, 0);
        expect(apps.reduce((s, a) => s + a.nGPerM2, 0)).toBeCloseTo(planned, 6);
      }),
    );
  });

  test('should scale paint in proportion to line length', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 5000, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (len, k) => {
        const s = e.DEFAULT_PARAMETERS.lines.touchUp;
        const one = e.paintNeed(len, 0.1, s);
        const scaled = e.paintNeed(len * k, 0.1, s);
        expect(scaled.concentrateLitres).toBeCloseTo(one.concentrateLitres * k, 6);
        expect(scaled.waterLitres).toBeCloseTo(one.waterLitres * k, 6);
      }),
    );
  });

  test('should never return a longer tour than the input order', () => {
    const stop = fc.record({ lat: fc.double({ min: 39.9, max: 40.1, noNaN: true }), lng: fc.double({ min: -88.1, max: -87.9, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(stop, { minLength: 0, maxLength: 12 }), (pts) => {
        const yard = { lat: 40, lng: -88 };
        const stops = pts.map((p, i) => ({ id: i, ...p }));
        const planned = e.planRoute(yard, stops, { roadFactor: 1.3 });
        expect(planned.totalKm).toBeLessThanOrEqual(e.tourLengthKm(yard, stops, 1.3) + 1e-9);
        expect([...planned.order].sort((a, b) => Number(a) - Number(b))).toEqual(stops.map((s) => s.id));
        // Deterministic for equal inputs.
        expect(e.planRoute(yard, stops, { roadFactor: 1.3 })).toEqual(planned);
      }),
    );
  });

  test('should keep ET0 finite and non-negative over the physical range (Hargreaves)', () => {
    fc.assert(
      fc.property(fc.double({ min: -30, max: 45, noNaN: true }), fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }), fc.integer({ min: 1, max: 365 }), (tmin, range, lat, doy) => {
        const v = e.et0Hargreaves(Math.min(60, tmin + range), tmin, lat, doy);
        expect(Number.isFinite(v)).toBe(true);
        expect(v).toBeGreaterThanOrEqual(0);
      }),
    );
  });
});
