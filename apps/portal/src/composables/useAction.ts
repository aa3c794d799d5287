import { ElMessage } from 'element-plus';
import { ref, type Ref } from 'vue';
import { errorMessage } from '../api/messages.ts';

/**
 * An action a button starts outside a form (a preview, a comparison, an upload): `busy` while
 * it runs, and the message of its failure after. `run(work, failed)` clears the last failure,
 * runs `work`, and on an error calls `failed(error)` (to drop what the last answer showed) and
 * keeps the error's message in `failure`.
 *
 * `runFor(key, work, failed)` does the same and names in `busyFor` which of several like
 * buttons started it (a table row's Save), so only that one shows it is loading. With
 * `{ toast: true }` a failure is shown as an error message instead, for a page with no place
 * beside the button to keep it.
 */
export function useAction<Key = never>(options: { toast?: boolean } = {}) {
  const busy = ref(false);
  const busyFor = ref(null) as Ref<Key | null>;
  const failure = ref<string | null>(null);

  async function runFor(key: Key | null, work: () => Promise<void>, failed?: (error: unknown) => void): Promise<void> {
    failure.value = null;
    busy.value = true;
    busyFor.value = key;
    try {
      await work();
    } catch (error) {
      failed?.(error);
      if (options.toast) ElMessage.error(errorMessage(error));
      else failure.value = errorMessage(error);
    } finally {
      busy.value = false;
      busyFor.value = null;
    }
  }

  const run = (work: () => Promise<void>, failed?: (error: unknown) => void) => runFor(null, work, failed);

  return { busy, busyFor, failure, run, runFor };
}
