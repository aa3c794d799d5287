import { describe, expect, test } from 'vitest';
import { addDaysIso, createFieldEventSchema } from '@swardwise/domain';
import { buildDemoCity } from './demo-city.ts';
import { demoFieldEvents } from './demo-events.ts';

const city = buildDemoCity();
const SEEDED = '2026-12-01';
const events = demoFieldEvents(city, SEEDED);
const fieldOf = (i: number) => city.fields[i]!;
const near = (e: { startsOn: string }, seededOn = SEEDED) => e.startsOn >= addDaysIso(seededOn, -7) && e.startsOn <= addDaysIso(seededOn, 21);

describe('demo field events', () => {
  test('should give the same bookings for the same seeding date', () => {
    expect(demoFieldEvents(buildDemoCity(), SEEDED)).toEqual(events);
  });

  test('should move only the bookings near the seeding date with it', () => {
    const MAY = '2026-05-20';
    const other = demoFieldEvents(city, MAY);
    const farFromBoth = (list: typeof events) => list.filter((e) => !near(e, SEEDED) && !near(e, MAY));
    expect(farFromBoth(other)).toEqual(farFromBoth(events));
    expect(other.filter((e) => near(e, MAY)).length).toBeGreaterThan(5);
  });

  test('should give every booking a record the booking schema accepts', () => {
    for (const e of events) {
      const parsed = createFieldEventSchema.safeParse({ fieldId: 1, kind: e.kind, title: e.title, startsOn: e.startsOn, startTime: e.startTime, notes: e.notes });
      expect(parsed.success, `${e.startsOn} ${e.title}`).toBe(true);
    }
  });

  test('should book sports fields only, one booking a field a day', () => {
    expect(events.every((e) => fieldOf(e.fieldIndex).sport !== 'lawn')).toBe(true);
    const keys = events.map((e) => `${e.fieldIndex}:${e.startsOn}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  test('should play games every week or two through each sports field’s season', () => {
    const sportsFields = city.fields.map((f, i) => ({ f, i })).filter(({ f }) => f.sport !== 'lawn');
    for (const { f, i } of sportsFields) {
      const games = events.filter((e) => e.fieldIndex === i && e.kind === 'game' && e.startsOn <= '2026-11-30').map((e) => e.startsOn);
      expect(games.length, `${f.siteKey} ${f.name}`).toBeGreaterThanOrEqual(4);
      // Within a season no more than three missed slots in a row (byes): at most 6 weeks apart.
      const gaps = games.slice(1).map((d, k) => (Date.parse(d) - Date.parse(games[k]!)) / 86_400_000);
      const inSeasonGaps = gaps.filter((g) => g < 60);
      expect(Math.min(...inSeasonGaps), `${f.siteKey} ${f.name}`).toBeGreaterThanOrEqual(1);
      expect(Math.max(...inSeasonGaps), `${f.siteKey} ${f.name}`).toBeLessThanOrEqual(42);
    }
  });

  test('should hold a tournament or two over a weekend on open, well-kept fields', () => {
    const tournaments = events.filter((e) => e.kind === 'tournament');
    expect(tournaments.length).toBeGreaterThanOrEqual(2);
    for (const t of tournaments) {
      const f = fieldOf(t.fieldIndex);
      expect(f.status).toBe('open');
      expect(f.maintenanceLevel).toBeLessThanOrEqual(2);
      expect([0, 6]).toContain(new Date(`${t.startsOn}T00:00:00Z`).getUTCDay());
    }
    expect(events.some((e) => e.kind === 'practice')).toBe(true);
  });

  test('should book several games in the weeks around the seeding date, none on a closed field', () => {
    const around = events.filter((e) => near(e));
    expect(around.length).toBeGreaterThanOrEqual(8);
    expect(around.filter((e) => e.startsOn >= SEEDED && e.startsOn <= addDaysIso(SEEDED, 13)).length).toBeGreaterThanOrEqual(4);
    expect(around.every((e) => fieldOf(e.fieldIndex).status !== 'closed')).toBe(true);
    expect(new Set(around.map((e) => city.sites.find((s) => s.key === fieldOf(e.fieldIndex).siteKey)!.districtCode)).size).toBe(3);
  });
});
