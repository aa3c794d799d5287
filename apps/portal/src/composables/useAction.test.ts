import { ElMessage } from 'element-plus';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { useAction } from './useAction.ts';

describe('useAction', () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

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
      (error) => {
        dropped = error instanceof Error;
      },
    );
    expect(a.failure.value).toBe('The comparison could not be worked out.');
    expect(dropped).toBe(true);
    expect(a.busy.value).toBe(false);
  });

  test('should name the button that runs in busyFor and clear it after', async () => {
    const a = useAction<string>();
    let seen: string | null = null;
    let seenBusy = false;
    await a.runFor('labour', async () => {
      seen = a.busyFor.value;
      seenBusy = a.busy.value;
    });
    expect(seen).toBe('labour');
    expect(seenBusy).toBe(true);
    expect(a.busyFor.value).toBeNull();
    expect(a.busy.value).toBe(false);
  });

  test('should show a failure as an error message with toast, and keep none', async () => {
    const shown = vi.spyOn(ElMessage, 'error').mockImplementation(() => ({ close: () => undefined }) as never);
    const a = useAction<number>({ toast: true });
    await a.runFor(7, () => Promise.reject(new Error('The e-mail could not be queued.')));
    expect(shown).toHaveBeenCalledWith('The e-mail could not be queued.');
    expect(a.failure.value).toBeNull();
    expect(a.busyFor.value).toBeNull();
  });
});
