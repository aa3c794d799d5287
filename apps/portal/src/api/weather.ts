import { api, ApiError } from './client.ts';
import type { Items, StationCsvAnswer, StationCsvRow, WeatherDayRow, WeatherStationRow } from './types.ts';

/** An error answer of the weather routes, with the rows or days the server could not use. */
export class WeatherError extends ApiError {
  readonly rows: StationCsvRow[];
  readonly rejected: { date: string | null; message: string }[];

  constructor(base: ApiError, details: { rows?: StationCsvRow[]; rejected?: { date: string | null; message: string }[] } = {}) {
    super(base.status, base.code, base.message, base.issues);
    this.rows = details.rows ?? [];
    this.rejected = details.rejected ?? [];
  }
}

export async function listStations(signal?: AbortSignal): Promise<{ items: WeatherStationRow[]; service: boolean }> {
  return api.get<Items<WeatherStationRow> & { service: boolean }>('/weather/stations', undefined, signal);
}

export async function listWeatherDays(stationId: number, from: string, to: string, signal?: AbortSignal): Promise<{ days: WeatherDayRow[]; gaps: string[] }> {
  return api.get<{ days: WeatherDayRow[]; gaps: string[] }>(`/weather/stations/${stationId}/days`, { from, to }, signal);
}

/** Posts a request whose error answer may carry details beyond field issues. */
async function send<T>(path: string, body: FormData | object): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: body instanceof FormData ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body instanceof FormData ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network/unreachable', 'The server cannot be reached. Check your connection and try again.');
  }
  const payload = (await response.json().catch(() => undefined)) as
    | (T & { error?: { code: string; message: string; details?: { issues?: { path: string; message: string }[]; rows?: StationCsvRow[]; rejected?: { date: string | null; message: string }[] } } })
    | undefined;
  if (response.ok && payload) return payload;
  const error = payload?.error;
  if (!error) throw new ApiError(response.status, `http/${response.status}`, response.status === 413 ? 'The file is too large to upload.' : `The server answered ${response.status}.`);
  throw new WeatherError(new ApiError(response.status, error.code, error.message, error.details?.issues ?? []), error.details);
}

/** Checks a station file (commit = false) or saves it, all rows or none (commit = true). */
export function uploadStationCsv(stationId: number, file: File, commit: boolean): Promise<StationCsvAnswer> {
  const form = new FormData();
  form.append('file', file);
  return send<StationCsvAnswer>(`/weather/stations/${stationId}/csv?commit=${commit}`, form);
}

export function pullWeather(stationId: number, from: string, to: string): Promise<{ saved: number; missing: string[] }> {
  return send<{ saved: number; missing: string[] }>(`/weather/stations/${stationId}/pull`, { from, to });
}
