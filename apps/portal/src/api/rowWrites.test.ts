import { afterEach, describe, expect, test, vi } from 'vitest';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

describe('rowWrites', () => {
  afterEach(() => vi.restoreAllMocks());
  const writes = rowWrites<{ crew: { id: number; name: string } }, { name: string }, { name: string; version: number }>('crews', 'crew');

  test('should post a new row and patch a changed one, answering the row under its key', async () => {
    const post = vi.spyOn(api, 'post').mockResolvedValue({ crew: { id: 7, name: 'East mowing' } });
    const patch = vi.spyOn(api, 'patch').mockResolvedValue({ crew: { id: 7, name: 'East mowing B' } });
    expect(await writes.create({ name: 'East mowing' })).toEqual({ id: 7, name: 'East mowing' });
    expect(await writes.update(7, { name: 'East mowing B', version: 1 })).toEqual({ id: 7, name: 'East mowing B' });
    expect(post).toHaveBeenCalledWith('/crews', { name: 'East mowing' });
    expect(patch).toHaveBeenCalledWith('/crews/7', { name: 'East mowing B', version: 1 });
  });

  test('should delete with the version the person saw', async () => {
    const del = vi.spyOn(api, 'delete').mockResolvedValue(undefined);
    await writes.remove(7, 3);
    expect(del).toHaveBeenCalledWith('/crews/7?version=3');
  });
});
