import { ref } from 'vue';
import { errorMessage } from '../api/messages.ts';

/**
 * An action a button starts outside a form (a preview, a comparison, an upload): `busy` while
 * it runs, and the message of its failure after. `run(work, failed)` clears the last failure,
 * runs `work`, and on an error calls `failed` (to drop what the last answer showed) and keeps
 * the error's message in `failure`.
 */
export function useAction() {
  const busy = ref(false);
  const failure = ref<string | null>(null);

  async function run(work: () => Promise<void>, failed?: () => void): Promise<void> {
    failure.value = null;
    busy.value = true;
    try {
      await work();
    } catch (error) {
      failed?.();
      failure.value = errorMessage(error);
    } finally {
      busy.value = false;
    }
  }

  return { busy, failure, run };
}
