/**
 * A season of invented daily weather for the demo city's stations: a transition-zone climate
 * (hot humid summers, cool springs and autumns) made from a seasonal sine, a day-to-day
 * anomaly, and rain events every few days. Deterministic: the same numbers on every build.
 */
import { addDaysIso } from '@swardwise/domain';
import { mulberry32, normal, rngFor, uniform } from './prng.ts';

export interface DemoWeatherStation {
  code: string;
  name: string;
  lat: number;
  lng: number;
  elevationM: number;
}

export interface DemoWeatherDay {
  stationCode: string;
  /** YYYY-MM-DD */
  date: string;
  tmaxC: number;
  tminC: number;
  rhMaxPct: number;
  rhMinPct: number;
  /** Mean wind speed at 2 m, m/s. */
  windMs: number;
  sunshineH: number;
  rainMm: number;
}

export const DEMO_SEASON = { start: '2026-03-01', end: '2026-11-30' } as const;

const DAY_MS = 86_400_000;

/** Day of the year (1 = 1 January) of a UTC date. */
function dayOfYear(date: Date): number {
  return Math.round((date.getTime() - Date.UTC(date.getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
}

/** Daylight hours N at a latitude on a day of the year (FAO-56 eqs 24, 25 and 34). */
function daylightHours(latDeg: number, doy: number): number {
  const phi = (latDeg * Math.PI) / 180;
  const delta = 0.409 * Math.sin((2 * Math.PI * doy) / 365 - 1.39);
  const x = Math.min(1, Math.max(-1, -Math.tan(phi) * Math.tan(delta)));
  return (24 / Math.PI) * Math.acos(x);
}

/** The season's dates, first to last, as UTC dates. */
function seasonDates(start: string = DEMO_SEASON.start, end: string = DEMO_SEASON.end): Date[] {
  const dates: Date[] = [];
  const last = Date.parse(`${end}T00:00:00Z`);
  for (let t = Date.parse(`${start}T00:00:00Z`); t <= last; t += DAY_MS) dates.push(new Date(t));
  return dates;
}

const round1 = (x: number) => Math.round(x * 10) / 10;
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));

/** How a station differs from the city-wide weather (a lakeside station is milder and damper). */
export interface StationClimate {
  tempOffsetC: number;
  rangeOffsetC: number;
  rhOffsetPct: number;
  windOffsetMs: number;
}

/**
 * City-wide weather of each day: the temperature anomaly and the rain events, shared by all
 * stations so that they agree the way neighbouring stations do.
 */
interface CityDay {
  doy: number;
  anomalyC: number;
  rainEventMm: number;
  wetBefore: boolean;
}

function cityWeather(dates: Date[]): CityDay[] {
  const rng = mulberry32(20_260_301);
  const days: CityDay[] = [];
  let anomaly = 0;
  let nextEvent = 2;
  let eventDaysLeft = 0;
  let eventMean = 0;
  dates.forEach((date, i) => {
    const doy = dayOfYear(date);
    anomaly = 0.7 * anomaly + 1.7 * normal(rng);
    let rainEventMm = 0;
    if (i === nextEvent) {
      eventDaysLeft = rng() < 0.3 ? 2 : 1;
      // Summer storms carry more rain than spring and autumn fronts.
      const summer = Math.max(0, Math.sin((2 * Math.PI * (doy - 111)) / 365));
      eventMean = 8 + 6 * summer;
      nextEvent = i + 3 + Math.floor(rng() * 5); // every 3–7 days, about 5 on average
    }
    if (eventDaysLeft > 0) {
      rainEventMm = clamp(-eventMean * Math.log(1 - rng() * 0.995), 0.5, 75);
      eventDaysLeft--;
    }
    days.push({ doy, anomalyC: anomaly, rainEventMm, wetBefore: (days[i - 1]?.rainEventMm ?? 0) > 0 });
  });
  return days;
}

/** Daily weather of one station over the season. */
export function stationSeason(
  station: DemoWeatherStation,
  climate: StationClimate,
  dates: Date[] = seasonDates(),
): DemoWeatherDay[] {
  const city = cityWeather(dates);
  const rng = rngFor(`weather:${station.code}`);
  return dates.map((date, i) => {
    const day = city[i]!;
    const seasonal = Math.sin((2 * Math.PI * (day.doy - 111)) / 365); // +1 about 20 July
    const humidSeason = Math.max(0, seasonal);

    // Rain: the city's event, more or less, and now and then a light shower of its own.
    let rain = 0;
    if (day.rainEventMm > 0) {
      rain = day.rainEventMm * uniform(rng, 0.7, 1.3);
      if (rain < 3 && rng() < 0.2) rain = 0;
    } else if (rng() < 0.04) {
      rain = uniform(rng, 0.2, 2.5);
    }
    rain = round1(rain);
    const wet = rain >= 1;

    // Sunshine as a fraction of the day's daylight hours.
    const daylight = daylightHours(station.lat, day.doy);
    const sunFraction = wet ? uniform(rng, 0.04, 0.35) : day.wetBefore ? uniform(rng, 0.35, 0.72) : uniform(rng, 0.55, 0.93);
    const sunshineH = Math.floor(sunFraction * daylight * 10) / 10;

    // Temperature: seasonal mean, anomaly, cooler under rain; the daily range follows the sun.
    const meanC = 14.2 + 10.8 * seasonal + day.anomalyC + climate.tempOffsetC + 0.4 * normal(rng) - (wet ? 1.2 : 0);
    const rangeC = round1(clamp(8 + (6 * (sunFraction - 0.04)) / 0.89 + climate.rangeOffsetC + 0.4 * normal(rng), 8, 14));
    const tmaxC = round1(meanC + rangeC / 2);
    const tminC = round1(tmaxC - rangeC);

    // Humidity: near saturation at dawn, lowest in the afternoon; damp summers, wet days.
    const rhMaxPct = Math.round(clamp((wet ? uniform(rng, 94, 100) : uniform(rng, 78, 95) + 3 * humidSeason) + climate.rhOffsetPct, 60, 100));
    const rhMinRaw = wet ? uniform(rng, 62, 88) : 30 + 12 * humidSeason + 22 * (1 - sunFraction) + 6 * normal(rng);
    const rhMinPct = Math.round(clamp(rhMinRaw + climate.rhOffsetPct, 18, rhMaxPct - 8));

    // Wind at 2 m: breezier in spring and on days with a front.
    const windMs = round1(clamp(2.2 + 0.6 * Math.cos((2 * Math.PI * (day.doy - 80)) / 365) + 0.5 * normal(rng) + (wet ? 0.4 : 0) + climate.windOffsetMs, 1, 4));

    return {
      stationCode: station.code,
      date: date.toISOString().slice(0, 10),
      tmaxC,
      tminC,
      rhMaxPct,
      rhMinPct,
      windMs,
      sunshineH,
      rainMm: rain,
    };
  });
}

/**
 * The day from which the demo's weather runs on: the series is generated from it, so a date
 * always gets the same weather whatever window is asked for. Dates before it come from an
 * earlier run from 1 January 2025 (or from the first 1 January asked for, if earlier still).
 */
const WEATHER_EPOCH = DEMO_SEASON.start;
const EARLY_EPOCH = '2025-01-01';

/**
 * A station's invented daily weather from `from` to `to` (inclusive), whatever the dates: the
 * same generator as `stationSeason`, run on from a fixed epoch so that a day's weather does
 * not depend on the window (the seed, the fake weather service and the tests agree).
 */
export function stationWeather(station: DemoWeatherStation, climate: StationClimate, from: string, to: string): DemoWeatherDay[] {
  if (to < from) return [];
  const out: DemoWeatherDay[] = [];
  const main = WEATHER_EPOCH;
  const early = from < EARLY_EPOCH ? `${from.slice(0, 4)}-01-01` : EARLY_EPOCH;
  if (from < main) {
    const end = to < main ? to : addDaysIso(main, -1);
    out.push(...stationSeason(station, climate, seasonDates(early, end)).filter((d) => d.date >= from));
  }
  if (to >= main) out.push(...stationSeason(station, climate, seasonDates(main, to)).filter((d) => d.date >= from));
  return out;
}
