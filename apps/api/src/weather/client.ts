/**
 * Client of the hosted weather service: asks for a range of days at a place, with a
 * timeout, and turns every failure into a clear message. It validates each day and lists
 * the days the answer left out; it writes nothing itself.
 */
import { addDaysIso, errors, weatherDaySchema, type WeatherDayInput } from '@swardwise/domain';
import { providerDaySchema, providerResponseSchema } from './provider.ts';

export interface WeatherClientSettings {
  baseUrl: string;
  apiKey: string;
  timeoutMs: number;
}

export interface FetchedWeather {
  days: WeatherDayInput[];
  /** Dates in the range the service did not answer for. */
  missing: string[];
  /** Rows that were not usable, with the reason. */
  rejected: { date: string | null; message: string }[];
}

export async function fetchWeather(settings: WeatherClientSettings | null, at: { lat: number; lng: number }, from: string, to: string): Promise<FetchedWeather> {
  if (!settings) throw errors.weatherService('not_configured', 'No weather service is configured (WEATHER_API_URL); upload a station file instead');
  const url = new URL('/v1/daily', settings.baseUrl);
  url.search = new URLSearchParams({ lat: String(at.lat), lng: String(at.lng), from, to }).toString();
  let res: Response;
  try {
    res = await fetch(url, { headers: { 'x-api-key': settings.apiKey, accept: 'application/json' }, signal: AbortSignal.timeout(settings.timeoutMs) });
  } catch (err) {
    if ((err as Error).name === 'TimeoutError' || (err as Error).name === 'AbortError') {
      throw errors.weatherService('timeout', `The weather service did not answer within ${Math.round(settings.timeoutMs / 1000)} s; nothing was saved, try again later`);
    }
    throw errors.weatherService('unreachable', 'The weather service cannot be reached; nothing was saved, try again later');
  }
  if (res.status === 401 || res.status === 403) throw errors.weatherService('rejected_key', 'The weather service refused the API key (WEATHER_API_KEY); nothing was saved');
  if (!res.ok) throw errors.weatherService('upstream_error', `The weather service answered with an error (${res.status}); nothing was saved, try again later`);
  let body: unknown;
  try {
    body = await res.json();
  } catch {
    throw errors.weatherService('malformed', 'The weather service sent something that is not weather data; nothing was saved');
  }
  const parsed = providerResponseSchema.safeParse(body);
  if (!parsed.success) throw errors.weatherService('malformed', 'The weather service sent an answer in an unexpected shape; nothing was saved');

  const days: WeatherDayInput[] = [];
  const rejected: FetchedWeather['rejected'] = [];
  for (const raw of parsed.data.days) {
    const wire = providerDaySchema.safeParse(raw);
    const date = typeof (raw as { date?: unknown })?.date === 'string' ? (raw as { date: string }).date : null;
    if (!wire.success) {
      rejected.push({ date, message: `${wire.error.issues[0]?.path.join('.') ?? 'row'}: ${wire.error.issues[0]?.message ?? 'not valid'}` });
      continue;
    }
    const w = wire.data;
    const day = weatherDaySchema.safeParse({
      date: w.date,
      kind: w.kind,
      tmaxC: w.t_max_c,
      tminC: w.t_min_c,
      rhMaxPct: w.rh_max_pct,
      rhMinPct: w.rh_min_pct,
      windMs: w.wind_2m_ms,
      sunshineH: w.sunshine_h,
      solarMJ: w.solar_mj,
      rainMm: w.rain_mm,
    });
    if (!day.success) {
      rejected.push({ date, message: `${day.error.issues[0]?.path.join('.') ?? 'row'}: ${day.error.issues[0]?.message ?? 'not valid'}` });
      continue;
    }
    if (day.data.date < from || day.data.date > to) continue;
    days.push(day.data);
  }
  const have = new Set(days.map((d) => d.date));
  const missing: string[] = [];
  for (let d = from; d <= to; d = addDaysIso(d, 1)) if (!have.has(d) && !rejected.some((r) => r.date === d)) missing.push(d);
  return { days, missing, rejected };
}
