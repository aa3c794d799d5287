import { describe, expect, test } from 'vitest';
import {
  DEFAULT_PARAMETERS,
  DEFAULT_STANDARDS,
  addDaysIso,
  fieldDailySeries,
  grassSeason,
  hocFor,
  isoToDayNumber,
  levelStandard,
  mowingPolicy,
  prepareWeather,
  simulateMowing,
  weekdayOf,
  type Level,
} from '@swardwise/domain';
import { outlineFacts } from '../../services/fields.ts';
import { startFakeWeather } from '../../weather/fake-server.ts';
import { buildDemoCity, demoCityWeather } from './demo-city.ts';
import { demoFieldEvents } from './demo-events.ts';
import { DEMO_FORECAST_DAYS, DEMO_WORK_DAYS, PLAYABLE_GP, buildDemoSeason, demoSeasonWindow } from './demo-season.ts';

const city = buildDemoCity();
const TODAY = '2026-12-02';
const season = buildDemoSeason(city, TODAY);
const districtOf = (fieldIndex: number) => city.sites.find((s) => s.key === city.fields[fieldIndex]!.siteKey)!.districtCode;

describe('demo season', () => {
  test('should be the same for the same day, and laid back to 1 March of the season in progress', () => {
    expect(JSON.stringify(buildDemoSeason(buildDemoCity(), TODAY))).toBe(JSON.stringify(season));
    expect(demoSeasonWindow('2026-12-02').start).toBe('2026-03-01');
    expect(demoSeasonWindow('2026-07-15').start).toBe('2026-03-01');
    // Before July the season in progress is too young: last year's is shown.
    expect(demoSeasonWindow('2027-03-20').start).toBe('2026-03-01');
  });

  test('should give every district done work orders back to the season’s start, and none from today on', () => {
    for (const d of city.districts) {
      const mine = season.orders.filter((o) => districtOf(o.fieldIndex) === d.code);
      const done = mine.filter((o) => o.status === 'done');
      expect(done.length, d.code).toBeGreaterThan(300);
      expect(mine[0]!.plannedDate < '2026-03-15', d.code).toBe(true);
      // Work in every month of the growing season.
      for (const m of ['03', '04', '05', '06', '07', '08', '09', '10', '11']) expect(done.some((o) => o.plannedDate.startsWith(`2026-${m}`)), `${d.code} ${m}`).toBe(true);
    }
    expect(season.orders.every((o) => o.plannedDate < TODAY && (o.doneOn === null || o.doneOn < TODAY))).toBe(true);
    for (const o of season.orders.filter((x) => x.status === 'done')) {
      expect(o.actualHours).toBeGreaterThan(0);
      expect(DEMO_WORK_DAYS).toContain(weekdayOf(o.doneOn!));
    }
  });

  test('should mow as the one-third rule asks on the crews’ working days, with some late and some skipped', () => {
    const mow = season.orders.filter((o) => o.task === 'mow');
    const skipped = mow.filter((o) => o.status === 'skipped');
    const late = mow.filter((o) => o.status === 'done' && o.doneOn! > o.plannedDate);
    expect(skipped.length / mow.length).toBeGreaterThan(0.02);
    expect(skipped.length / mow.length).toBeLessThan(0.2);
    expect(late.length / mow.length).toBeGreaterThan(0.02);
    expect(late.length / mow.length).toBeLessThan(0.15);
    expect(skipped.every((o) => o.notes.length > 0)).toBe(true);
    expect(mow.every((o) => DEMO_WORK_DAYS.includes(weekdayOf(o.plannedDate)))).toBe(true);

    // Replay with the engine: after a cut on the day asked, the engine's run on the same
    // weather asks for the next cut exactly when the seed put it.
    const first = '2026-01-01';
    const weather = demoCityWeather(first, '2026-12-31');
    let checked = 0;
    city.fields.forEach((f, i) => {
      const mine = mow.filter((o) => o.fieldIndex === i);
      if (mine.length < 2) return;
      const site = city.sites.find((s) => s.key === f.siteKey)!;
      const station = [...city.weatherStations].sort((a, b) => (a.lat - site.lat) ** 2 + (a.lng - site.lng) ** 2 * 0.62 - ((b.lat - site.lat) ** 2 + (b.lng - site.lng) ** 2 * 0.62))[0]!;
      const prepared = prepareWeather(
        weather.filter((w) => w.stationCode === station.code),
        { latDeg: station.lat, elevationM: station.elevationM },
      );
      const field = { id: i, areaM2: outlineFacts(f.geometry).areaM2, sport: f.sport, grass: f.grass, maintenanceLevel: f.maintenanceLevel as Level, hocOverrideMm: f.hocOverrideMm, clippings: f.clippings, irrigation: f.irrigation };
      const growth = fieldDailySeries(field, prepared, DEFAULT_STANDARDS, DEFAULT_PARAMETERS).growthMm;
      const hoc = hocFor(field, DEFAULT_STANDARDS);
      const policy = mowingPolicy(hoc, levelStandard(field.maintenanceLevel, DEFAULT_STANDARDS));
      for (let k = 0; k + 1 < mine.length; k++) {
        const a = mine[k]!;
        const b = mine[k + 1]!;
        if (a.status !== 'done' || a.doneOn !== a.plannedDate) continue;
        const from = isoToDayNumber(a.plannedDate) - isoToDayNumber(first) + 1;
        const end = isoToDayNumber('2026-12-01') - isoToDayNumber(first);
        const sim = simulateMowing(hoc, growth.slice(from, end + 1), hoc + growth[from - 1]!, { startDate: addDaysIso(a.plannedDate, 1), ...policy, mowingDays: DEMO_WORK_DAYS });
        expect(sim.mowings[0]?.date, `${f.siteKey} ${f.name} after ${a.plannedDate}`).toBe(b.plannedDate);
        checked++;
      }
    });
    expect(checked).toBeGreaterThan(1000);
  });

  test('should apply the feed plan and weed control with product, rate and applicator', () => {
    const feeds = season.orders.filter((o) => o.task === 'feed');
    const sprays = season.orders.filter((o) => o.task === 'weed_control');
    expect(feeds.length).toBeGreaterThan(60);
    expect(sprays.length).toBeGreaterThan(5);
    for (const o of [...feeds, ...sprays]) {
      expect(o.details.productName).toEqual(expect.any(String));
      expect(o.details.applicator).toEqual(expect.any(String));
      expect(Number(o.details.rateGPerM2 ?? o.details.rateLPerHa)).toBeGreaterThan(0);
      expect(city.crews.find((c) => c.name === o.crewName)!.members).toContain(o.details.applicator);
    }
    // The feed plan follows growth: nothing in the dormant months.
    expect(feeds.every((o) => o.plannedDate.slice(5, 7) >= '03' && o.plannedDate.slice(5, 7) <= '11')).toBe(true);
    expect(new Set(feeds.map((o) => districtOf(o.fieldIndex))).size).toBe(3);
  });

  test('should check every kept field about monthly, with scores that move through the season', () => {
    const months = new Set(season.checks.map((c) => c.checkedOn.slice(0, 7)));
    expect(months.size).toBeGreaterThanOrEqual(8);
    city.fields.forEach((f, i) => {
      if (f.status === 'retired') return;
      expect(season.checks.filter((c) => c.fieldIndex === i).length, `${f.siteKey} ${f.name}`).toBeGreaterThanOrEqual(8);
    });
    const mean = (m: string) => {
      const list = season.checks.filter((c) => c.checkedOn.slice(5, 7) === m);
      return list.reduce((s, c) => s + c.turfCoverPct, 0) / list.length;
    };
    // Autumn wear: less cover in October than in April.
    expect(mean('10')).toBeLessThan(mean('04'));
    for (const c of season.checks) expect(c.turfCoverPct + c.weedsPct + c.barePct).toBeLessThanOrEqual(100);
  });

  test('should close a few sports fields for a day after a storm', () => {
    expect(season.closures.length).toBeGreaterThan(3);
    for (const c of season.closures) expect(city.fields[c.fieldIndex]!.sport).not.toBe('lawn');
  });

  test.each(['2026-07-15', '2026-12-02', '2027-03-20'])('should hold weather through yesterday and a week of forecast when started on %s', (today) => {
    const s = buildDemoSeason(city, today);
    for (const st of city.weatherStations) {
      const days = s.weather.filter((w) => w.stationCode === st.code);
      expect(days[0]!.date).toBe(s.window.start);
      expect(days.filter((w) => w.kind === 'observed').at(-1)!.date).toBe(addDaysIso(today, -1));
      const forecast = days.filter((w) => w.kind === 'forecast');
      expect(forecast.map((w) => w.date)).toEqual(Array.from({ length: DEMO_FORECAST_DAYS }, (_, k) => addDaysIso(today, k)));
      days.forEach((w, k) => expect(w.date).toBe(addDaysIso(s.window.start, k)));
    }
  });

  test.each(['2026-07-15', '2026-12-02', '2027-03-20'])('should book no game on dormant warm-season turf when started on %s', (today) => {
    const s = buildDemoSeason(city, today);
    const events = demoFieldEvents(city, today, s);
    const weather = demoCityWeather(`${s.window.start.slice(0, 4)}-01-01`, s.window.forecastEnd);
    const station = city.weatherStations[0]!;
    const prepared = prepareWeather(weather.filter((w) => w.stationCode === station.code), { latDeg: station.lat, elevationM: station.elevationM });
    const warm = events.filter((e) => grassSeason(city.fields[e.fieldIndex]!.grass) === 'warm' && e.startsOn <= s.window.forecastEnd);
    expect(warm.length).toBeGreaterThan(0);
    for (const e of warm) {
      const i = prepared.dates.indexOf(e.startsOn);
      let gp = 0;
      for (let k = i - 6; k <= i; k++) gp += prepared.gpWarm[k]!;
      // Within a few hundredths: the other station is a little warmer or cooler.
      expect(gp / 7, `${city.fields[e.fieldIndex]!.name} ${e.startsOn}`).toBeGreaterThan(PLAYABLE_GP - 0.08);
    }
    // Without the season's weather the same city would book baseball on dormant grass in March.
    const blind = demoFieldEvents(city, today).filter((e) => grassSeason(city.fields[e.fieldIndex]!.grass) === 'warm' && e.startsOn.slice(5, 7) === '03');
    expect(blind.length).toBeGreaterThan(0);
    expect(warm.some((e) => e.startsOn.slice(5, 7) === '03')).toBe(false);
  });

  test('should be the weather the local fake weather service answers at the demo’s stations', async () => {
    const fake = await startFakeWeather({ today: '2026-12-01' });
    try {
      const station = city.weatherStations[1]!;
      const res = await fetch(`${fake.url}/v1/daily?lat=${station.lat}&lng=${station.lng}&from=2026-11-20&to=2026-12-08`, { headers: { 'x-api-key': fake.apiKey } });
      const body = (await res.json()) as { days: { date: string; kind: string; t_max_c: number; t_min_c: number; rain_mm: number }[] };
      const seeded = season.weather.filter((w) => w.stationCode === station.code && w.date >= '2026-11-20');
      expect(body.days.map((d) => [d.date, d.t_max_c, d.t_min_c, d.rain_mm])).toEqual(seeded.map((w) => [w.date, w.tmaxC, w.tminC, w.rainMm]));
      expect(body.days.filter((d) => d.kind === 'forecast').map((d) => d.date)[0]).toBe('2026-12-02');
    } finally {
      await fake.close();
    }
  });
});
