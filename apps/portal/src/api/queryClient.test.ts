import { describe, expect, test } from 'vitest';
import { ApiError } from './client.ts';
import { shouldRetry } from './queryClient.ts';

describe('shouldRetry', () => {
  test('should ask again after a lost connection or a server failure, twice at most', () => {
    expect(shouldRetry(0, new ApiError(0, 'network/unreachable', 'unreachable'))).toBe(true);
    expect(shouldRetry(1, new ApiError(503, 'http/503', 'down'))).toBe(true);
    expect(shouldRetry(2, new ApiError(500, 'http/500', 'boom'))).toBe(false);
  });

  test('should not ask again after a 4xx, nor after an error the portal raised itself', () => {
    for (const status of [400, 401, 403, 404, 409, 429]) expect(shouldRetry(0, new ApiError(status, 'x/y', 'no'))).toBe(false);
    expect(shouldRetry(0, new Error('This sheet needs a crew and a day'))).toBe(false);
  });
});
