import type { FormInstance } from 'element-plus';
import { reactive, ref, shallowRef } from 'vue';
import type { ApiError } from '../api/client.ts';
import { errorMessage, fieldIssues, isConflict } from '../api/messages.ts';

export interface FormSubmitOptions {
  /** Checks the form before sending; by default the Element Plus form's own rules. */
  validate?: () => Promise<boolean>;
  /** Keeps the whole path of a field issue (`hocMm.soccer.cool`) instead of its first segment. */
  nestedIssues?: boolean;
  /** The form's key for an API field name, where the form names it differently. */
  issueKey?: (apiField: string) => string;
  /**
   * A stale write (409 version conflict). By default the form shows the conflict message with
   * `conflict` set (so it can offer a Reload button); a form that hands the conflict to its
   * page does that here instead.
   */
  onConflict?: (error: ApiError) => void;
}

/**
 * The submit cycle every form shares: clear the last errors, validate, send once at a time, and
 * on failure show the API's field issues under their fields and one message above the form.
 * `submit(send)` resolves true when `send` succeeded.
 */
export function useFormSubmit(options: FormSubmitOptions = {}) {
  const form = ref<FormInstance>();
  const serverErrors = reactive<Record<string, string>>({});
  const failure = ref<string | null>(null);
  /** The last failure was a version conflict. */
  const conflict = ref(false);
  /** The last error, for a form that words some failures its own way. */
  const lastError = shallowRef<unknown>(null);
  const submitting = ref(false);

  function clear() {
    for (const key of Object.keys(serverErrors)) delete serverErrors[key];
    failure.value = null;
    conflict.value = false;
    lastError.value = null;
  }

  async function submit(send: () => Promise<void>): Promise<boolean> {
    if (submitting.value) return false;
    clear();
    const valid = options.validate ? await options.validate() : await (form.value?.validate().catch(() => false) ?? false);
    if (!valid) return false;
    submitting.value = true;
    try {
      await send();
      return true;
    } catch (error) {
      lastError.value = error;
      if (isConflict(error)) {
        if (options.onConflict) options.onConflict(error);
        else {
          conflict.value = true;
          failure.value = errorMessage(error);
        }
        return false;
      }
      for (const [key, message] of Object.entries(fieldIssues(error, options.nestedIssues))) serverErrors[options.issueKey?.(key) ?? key] = message;
      failure.value = errorMessage(error);
      return false;
    } finally {
      submitting.value = false;
    }
  }

  return { form, serverErrors, failure, conflict, lastError, submitting, clear, submit };
}

export type FormSubmit = ReturnType<typeof useFormSubmit>;
