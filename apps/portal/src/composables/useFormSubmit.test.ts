import { describe, expect, test, vi } from 'vitest';
import { ApiError } from '../api/client.ts';
import { messageFor } from '../api/messages.ts';
import { useFormSubmit } from './useFormSubmit.ts';

const invalid = () => new ApiError(400, 'request/invalid', 'Invalid body', [
  { path: 'body.name', message: 'enter a name' },
  { path: 'body.hocMm.soccer.cool', message: 'a height of cut below 3 mm is not a turf height' },
]);
const stale = (resource: string) => new ApiError(409, `${resource}/version_conflict`, 'stale');
const valid = () => Promise.resolve(true);

describe('useFormSubmit', () => {
  test('should send once the form is valid and clear the last failure', async () => {
    const f = useFormSubmit({ validate: valid });
    expect(await f.submit(() => Promise.reject(invalid()))).toBe(false);
    expect(f.failure.value).toBe('Invalid body');
    const send = vi.fn(async () => undefined);
    expect(await f.submit(send)).toBe(true);
    expect(send).toHaveBeenCalledTimes(1);
    expect(f.failure.value).toBeNull();
    expect({ ...f.serverErrors }).toEqual({});
    expect(f.submitting.value).toBe(false);
  });

  test('should not send when the form is invalid', async () => {
    const f = useFormSubmit({ validate: () => Promise.resolve(false) });
    const send = vi.fn(async () => undefined);
    expect(await f.submit(send)).toBe(false);
    expect(send).not.toHaveBeenCalled();
  });

  test('should put the API’s field issues under their fields, by first segment or whole path', async () => {
    const flat = useFormSubmit({ validate: valid });
    await flat.submit(() => Promise.reject(invalid()));
    expect({ ...flat.serverErrors }).toEqual({ name: 'enter a name', hocMm: 'a height of cut below 3 mm is not a turf height' });
    const nested = useFormSubmit({ validate: valid, nestedIssues: true, issueKey: (k) => (k === 'name' ? 'title' : k) });
    await nested.submit(() => Promise.reject(invalid()));
    expect({ ...nested.serverErrors }).toEqual({ title: 'enter a name', 'hocMm.soccer.cool': 'a height of cut below 3 mm is not a turf height' });
  });

  test('should say someone else changed the row, naming it by the error code, and mark the conflict', async () => {
    const f = useFormSubmit({ validate: valid });
    await f.submit(() => Promise.reject(stale('field_event')));
    expect(f.conflict.value).toBe(true);
    expect(f.failure.value).toBe(messageFor('field_event/version_conflict'));
    expect(f.failure.value).toMatch(/^Someone else changed this booking since you opened it; reload/);
  });

  test('should hand a conflict to the page when asked, with no message of its own', async () => {
    const onConflict = vi.fn();
    const f = useFormSubmit({ validate: valid, onConflict });
    await f.submit(() => Promise.reject(stale('user')));
    expect(onConflict).toHaveBeenCalledWith(expect.objectContaining({ code: 'user/version_conflict' }));
    expect(f.failure.value).toBeNull();
    expect(f.conflict.value).toBe(false);
  });
});
