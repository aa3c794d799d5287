import { describe, expect, test } from 'vitest';
import { useAction } from './useAction.ts';

describe('useAction', () => {
  test('should be busy while the work runs and clear the last failure', async () => {
    const a = useAction();
    a.failure.value = 'an old failure';
    let seenBusy = false;
    await a.run(async () => {
      seenBusy = a.busy.value;
    });
    expect(seenBusy).toBe(true);
    expect(a.busy.value).toBe(false);
    expect(a.failure.value).toBeNull();
  });

  test('should keep the message of a failure and call failed', async () => {
    const a = useAction();
    let dropped = false;
    await a.run(
      () => Promise.reject(new Error('The comparison could not be worked out.')),
      () => {
        dropped = true;
      },
    );
    expect(a.failure.value).toBe('The comparison could not be worked out.');
    expect(dropped).toBe(true);
    expect(a.busy.value).toBe(false);
  });
});
