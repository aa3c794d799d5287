/** The submit of a field-check dialog: the schema's messages under their fields before anything is sent (the server checks again). */
import { fieldCheckSchema, type UnitSystem } from '@swardwise/domain';
import type { Ref } from 'vue';
import { useFormSubmit } from '../../composables/useFormSubmit.ts';
import { fieldCheckBody, type FieldCheckModel } from './fieldCheck.ts';

export function useFieldCheckSubmit(model: Readonly<Ref<FieldCheckModel>>, units: { readonly value: UnitSystem }) {
  const submission = useFormSubmit({
    validate: async () => {
      const parsed = fieldCheckSchema.safeParse(fieldCheckBody(model.value, units.value));
      if (parsed.success) return true;
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0] ?? '');
        if (!submission.serverErrors[key]) submission.serverErrors[key] = issue.message;
      }
      submission.failure.value = 'Check the marked fields';
      return false;
    },
  });
  return submission;
}
