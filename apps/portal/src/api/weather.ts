import type { ErrorBody, PullAnswer, StationCsvAnswer, StationCsvRow, StationsAnswer, WeatherDaysAnswer, WeatherErrorDetails } from '@swardwise/domain';
import { api, ApiError, errorOf, UNREACHABLE } from './client.ts';

/** An error answer of the weather routes, with the rows or days the server could not use. */
export class WeatherError extends ApiError {
  readonly rows: StationCsvRow[];
  readonly rejected: NonNullable<WeatherErrorDetails['rejected']>;

  constructor(base: ApiError, details: WeatherErrorDetails = {}) {
    super(base.status, base.code, base.message, base.issues);
    this.rows = details.rows ?? [];
    this.rejected = details.rejected ?? [];
  }
}

export function listStations(signal?: AbortSignal): Promise<StationsAnswer> {
  return api.get<StationsAnswer>('/weather/stations', undefined, signal);
}

export function listWeatherDays(stationId: number, from: string, to: string, signal?: AbortSignal): Promise<WeatherDaysAnswer> {
  return api.get<WeatherDaysAnswer>(`/weather/stations/${stationId}/days`, { from, to }, signal);
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
    throw new ApiError(0, 'network/unreachable', UNREACHABLE);
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (response.ok && payload) return payload as T;
  const error = errorOf(response.status, response.statusText, payload);
  const sent = (payload as ErrorBody | undefined)?.error;
  throw sent ? new WeatherError(error, sent.details as WeatherErrorDetails | undefined) : error;
}

/** Checks a station file (commit = false) or saves it, all rows or none (commit = true). */
export function uploadStationCsv(stationId: number, file: File, commit: boolean): Promise<StationCsvAnswer> {
  const form = new FormData();
  form.append('file', file);
  return send<StationCsvAnswer>(`/weather/stations/${stationId}/csv?commit=${commit}`, form);
}

export function pullWeather(stationId: number, from: string, to: string): Promise<PullAnswer> {
  return send<PullAnswer>(`/weather/stations/${stationId}/pull`, { from, to });
}
