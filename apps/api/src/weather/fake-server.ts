/**
 * A local stand-in for the hosted weather service: deterministic invented data in the
 * service's format. The dev script and the tests start it; a test can make it slow,
 * failing, malformed or gappy to exercise the client.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import express from 'express';
import { addDaysIso, dayOfYear, DEFAULT_TIME_ZONE, isoToDayNumber, localToday } from '@swardwise/domain';
import { demoCityWeather, demoWeatherStations } from '../db/seed/demo-city.ts';
import type { ProviderDay } from './provider.ts';

export type FakeBehaviour = 'ok' | 'slow' | 'error' | 'malformed' | 'gaps' | 'not_json';

export interface FakeWeather {
  url: string;
  apiKey: string;
  setBehaviour(b: FakeBehaviour): void;
  requests(): number;
  close(): Promise<void>;
}

/** A small deterministic hash → [0, 1), so the same place and day always get the same weather. */
function noise(...parts: number[]): number {
  let h = 2166136261;
  for (const p of parts) {
    h ^= Math.floor(p * 1000);
    h = Math.imul(h, 16777619);
  }
  return ((h >>> 0) % 100_000) / 100_000;
}

/** Invented mid-latitude weather with a seasonal cycle (no real place's data). */
function fakeDay(lat: number, lng: number, date: string, today: string): ProviderDay {
  const doy = dayOfYear(date);
  const season = Math.cos(((doy - 200) / 365) * 2 * Math.PI); // warmest mid-July
  const n = noise(lat, lng, isoToDayNumber(date));
  const tMean = 14 + 11 * season + (n - 0.5) * 6;
  const range = 8 + n * 6;
  const wet = n > 0.78;
  return {
    date,
    kind: date > today ? 'forecast' : 'observed',
    t_max_c: Math.round((tMean + range / 2) * 10) / 10,
    t_min_c: Math.round((tMean - range / 2) * 10) / 10,
    rh_max_pct: Math.round(80 + n * 18),
    rh_min_pct: Math.round(35 + n * 30),
    wind_2m_ms: Math.round((1 + n * 3) * 10) / 10,
    sunshine_h: Math.round((wet ? 2 : 6 + season * 3) * 10) / 10,
    solar_mj: null,
    rain_mm: wet ? Math.round(n * 30 * 10) / 10 : 0,
  };
}

/** How near (km) a place must be to a demo station to be served that station's demo weather. */
const DEMO_STATION_KM = 1;

/**
 * The demo city's own weather when the place is a demo station (the days the demo seeds are
 * the days this service answers, so pulling from it changes nothing but the newest days);
 * null elsewhere.
 */
function demoStationDays(lat: number, lng: number, from: string, to: string, today: string): ProviderDay[] | null {
  const station = demoWeatherStations().find((s) => Math.hypot((s.lat - lat) * 111, (s.lng - lng) * 111 * Math.cos((lat * Math.PI) / 180)) <= DEMO_STATION_KM);
  if (!station) return null;
  return demoCityWeather(from, to)
    .filter((w) => w.stationCode === station.code)
    .map((w) => ({
      date: w.date,
      kind: w.date > today ? 'forecast' : 'observed',
      t_max_c: w.tmaxC,
      t_min_c: w.tminC,
      rh_max_pct: w.rhMaxPct,
      rh_min_pct: w.rhMinPct,
      wind_2m_ms: w.windMs,
      sunshine_h: w.sunshineH,
      solar_mj: null,
      rain_mm: w.rainMm,
    }));
}

/** `today` (the last observed day) defaults to the local date in `timeZone`, by default the demo city's. */
export async function startFakeWeather(options: { port?: number; apiKey?: string; today?: string; timeZone?: string; slowMs?: number } = {}): Promise<FakeWeather> {
  const apiKey = options.apiKey ?? 'fake-weather-key';
  const today = options.today ?? localToday(options.timeZone ?? DEFAULT_TIME_ZONE);
  let behaviour: FakeBehaviour = 'ok';
  let count = 0;
  const app = express();

  app.get('/v1/daily', async (req, res) => {
    count += 1;
    if (req.get('x-api-key') !== apiKey) return void res.status(401).json({ message: 'unknown API key' });
    const lat = Number(req.query.lat);
    const lng = Number(req.query.lng);
    const from = String(req.query.from ?? '');
    const to = String(req.query.to ?? '');
    if (!Number.isFinite(lat) || !Number.isFinite(lng) || !/^\d{4}-\d{2}-\d{2}$/.test(from) || !/^\d{4}-\d{2}-\d{2}$/.test(to)) {
      return void res.status(400).json({ message: 'lat, lng, from and to are required' });
    }
    if (behaviour === 'slow') await new Promise((r) => setTimeout(r, options.slowMs ?? 3000));
    if (behaviour === 'error') return void res.status(502).json({ message: 'upstream station network unavailable' });
    if (behaviour === 'not_json') return void res.type('text/html').send('<html>maintenance</html>');
    const days: unknown[] = [];
    const last = to < from ? to : addDaysIso(from, 399) < to ? addDaysIso(from, 399) : to;
    const demo = demoStationDays(lat, lng, from, last, today);
    for (let d = from, i = 0; d <= to && i < 400; d = addDaysIso(d, 1), i += 1) {
      if (behaviour === 'gaps' && i % 4 === 2) continue;
      const day: Record<string, unknown> = demo?.[i] ?? fakeDay(lat, lng, d, today);
      if (behaviour === 'malformed' && i === 1) day.t_max_c = 'hot';
      if (behaviour === 'malformed' && i === 3) day.t_min_c = (day.t_max_c as number) + 5;
      days.push(day);
    }
    res.json({ location: { lat, lng, elevation_m: 20 }, days });
  });

  const server: Server = await new Promise((resolve) => {
    const s = app.listen(options.port ?? 0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    apiKey,
    setBehaviour: (b) => {
      behaviour = b;
    },
    requests: () => count,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

// `node --import tsx apps/api/src/weather/fake-server.ts` runs it on its own (the dev script does).
if (import.meta.url === `file://${process.argv[1]}`) {
  const port = Number(process.env.FAKE_WEATHER_PORT ?? 3099);
  const fake = await startFakeWeather({ port, apiKey: process.env.WEATHER_API_KEY ?? 'dev-weather-key', timeZone: process.env.DEPARTMENT_TIME_ZONE || undefined });
  console.warn(`fake weather service on ${fake.url} (key ${fake.apiKey})`);
}
