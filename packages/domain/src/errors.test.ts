import { describe, expect, test } from 'vitest';
import { AppError, DomainError, ERROR_CODES, ERROR_STATUS, appError, errors, isApiErrorCode, kindOf } from './errors.ts';

describe('error codes', () => {
  test('should namespace every code by resource in lower-case snake case', () => {
    const codes = Object.keys(ERROR_CODES);
    expect(codes.length).toBeGreaterThan(60);
    for (const code of codes) expect(code).toMatch(/^[a-z]+(_[a-z]+)*\/[a-z]+(_[a-z]+)*$/);
  });

  test('should give every code a kind with an HTTP status', () => {
    for (const [code, kind] of Object.entries(ERROR_CODES)) expect(ERROR_STATUS[kind], code).toBeGreaterThanOrEqual(400);
    expect(appError('request/invalid', 'bad').status).toBe(400);
    expect(appError('auth/unauthenticated', 'sign in').status).toBe(401);
    expect(appError('user/forbidden_attribute', 'no').status).toBe(403);
    expect(appError('weather/none', 'no weather').status).toBe(404);
    expect(appError('import/not_last', 'undo the later one').status).toBe(409);
    expect(appError('work_photo/too_large', 'smaller').status).toBe(413);
    expect(appError('import/unsupported_type', 'csv please').status).toBe(415);
    expect(appError('auth/rate_limited', 'wait').status).toBe(429);
    expect(appError('weather/timeout', 'later').status).toBe(503);
  });

  test('should tell a listed code from any other string', () => {
    expect(isApiErrorCode('field/has_work_history')).toBe(true);
    expect(isApiErrorCode('field/nonsense')).toBe(false);
    expect(isApiErrorCode('toString')).toBe(false);
    expect(kindOf('engine/negative_area')).toBe('invalid');
  });

  test('should refuse an unknown code at compile time', () => {
    // @ts-expect-error — not a code the API answers with
    const made = () => appError('field/nonsense', 'x');
    expect(made).toBeTypeOf('function');
    // @ts-expect-error — a resource without rows to miss
    const missing = () => errors.notFound('weather', 1);
    expect(missing).toBeTypeOf('function');
  });
});

describe('error factories', () => {
  test('should write not found and version conflict once for every resource', () => {
    const missing = errors.notFound('field_event', 7);
    expect(missing).toBeInstanceOf(AppError);
    expect(missing.toBody()).toEqual({ error: { code: 'field_event/not_found', message: 'No field_event with id 7' } });
    expect(missing.status).toBe(404);
    expect(errors.notFound('weather_station', 3).message).toBe('No weather station with id 3');
    const stale = errors.versionConflict('site');
    expect(stale.code).toBe('site/version_conflict');
    expect(stale.status).toBe(409);
    expect(stale.message).toMatch(/^Someone else changed this site since you opened it/);
  });

  test('should put the bad inputs of a 400 in details.issues', () => {
    expect(errors.noSuch('district', 'body.districtId').toBody()).toEqual({
      error: { code: 'request/invalid', message: 'No such district', details: { issues: [{ path: 'body.districtId', message: 'no such district' }] } },
    });
    expect(errors.invalid('HOC too low', [{ path: 'body.hocMm', message: 'too low' }]).details).toEqual({ issues: [{ path: 'body.hocMm', message: 'too low' }] });
  });

  test('should answer a bad computation input as 400 with the engine’s code', () => {
    const err = errors.fromDomain(new DomainError('engine/negative_area', 'The area must not be negative', { value: -1 }));
    expect(err.status).toBe(400);
    expect(err.toBody()).toEqual({ error: { code: 'engine/negative_area', message: 'The area must not be negative', details: { value: -1 } } });
  });

  test('should keep 415 for a body the HTTP layer cannot decode and 400 for other refusals', () => {
    expect(errors.refusedRequest(415, 'unsupported charset').status).toBe(415);
    expect(errors.refusedRequest(400, 'bad path').status).toBe(400);
    expect(errors.refusedRequest(415, 'x').code).toBe('request/invalid');
  });

  test('should answer the unforeseen with 500 and a message that says nothing of the cause', () => {
    expect(errors.internal().status).toBe(500);
    expect(errors.internal().toBody()).toEqual({ error: { code: 'server/internal', message: 'Something went wrong on the server; nothing was saved' } });
  });
});
