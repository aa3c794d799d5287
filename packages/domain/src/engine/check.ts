/**
 * Input guards shared by the engine modules. Every guard throws a `DomainError` with an
 * `engine/…` code so the API can answer 400 and the portal can show the message.
 */
import { DomainError } from '../errors.ts';

/** Throws `engine/<code>` unless `value` is a finite number. */
export function requireFinite(value: number, code: string, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DomainError(`engine/${code}`, `${what} must be a finite number (got ${String(value)})`, { value });
  }
  return value;
}

/** Throws unless `value` is finite and > 0. */
export function requirePositive(value: number, code: string, what: string): number {
  requireFinite(value, code, what);
  if (value <= 0) throw new DomainError(`engine/${code}`, `${what} must be greater than zero (got ${value})`, { value });
  return value;
}

/** Throws unless `value` is finite and ≥ 0. */
export function requireNonNegative(value: number, code: string, what: string): number {
  requireFinite(value, code, what);
  if (value < 0) throw new DomainError(`engine/${code}`, `${what} must not be negative (got ${value})`, { value });
  return value;
}

/** Throws unless `min ≤ value ≤ max`. */
export function requireRange(value: number, min: number, max: number, code: string, what: string): number {
  requireFinite(value, code, what);
  if (value < min || value > max) {
    throw new DomainError(`engine/${code}`, `${what} must be between ${min} and ${max} (got ${value})`, { value, min, max });
  }
  return value;
}

/** Air temperature in °C within the physical range used by the engine (−60 to 60 °C). */
export function requireTemperature(value: number, what = 'temperature'): number {
  return requireRange(value, -60, 60, 'invalid_temperature', `${what} (°C)`);
}

/** Tmax and Tmin in °C, each in range and Tmin ≤ Tmax. */
export function requireTmaxTmin(tmaxC: number, tminC: number): void {
  requireTemperature(tmaxC, 'Tmax');
  requireTemperature(tminC, 'Tmin');
  if (tminC > tmaxC) {
    throw new DomainError('engine/invalid_temperature', `Tmin (${tminC} °C) must not be above Tmax (${tmaxC} °C)`, { tmaxC, tminC });
  }
}

/** Relative humidity in %, 0–100. */
export function requireHumidity(value: number, what = 'relative humidity'): number {
  return requireRange(value, 0, 100, 'invalid_humidity', `${what} (%)`);
}

/** A fraction 0–1 (efficiency, share, DU). */
export function requireFraction(value: number, code: string, what: string, allowZero = false): number {
  requireFinite(value, code, what);
  if (value > 1 || value < 0 || (!allowZero && value === 0)) {
    throw new DomainError(`engine/${code}`, `${what} must be ${allowZero ? 'between 0' : 'above 0'} and 1 (got ${value})`, { value });
  }
  return value;
}

/** Throws `engine/<code>` with `message`. */
export function fail(code: string, message: string, details?: Record<string, unknown>): never {
  throw new DomainError(`engine/${code}`, message, details);
}
