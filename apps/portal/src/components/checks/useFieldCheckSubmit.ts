/** The submit of a field-check dialog: the schema's messages under their fields before anything is sent (the server checks again). */
import { fieldCheckSchema, type FieldCheckAnswer, type FieldCheckBody, type UnitSystem } from '@swardwise/domain';
import { ref, type Ref } from 'vue';
import { errorMessage } from '../../api/messages.ts';
import { useFormSubmit } from '../../composables/useFormSubmit.ts';
import { emptyFieldCheck, fieldCheckBody, type FieldCheckModel } from './fieldCheck.ts';

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

/**
 * What a field-check dialog holds (the form, the photos picked, the result once logged) and how
 * it logs a check: `send` stores the check, then each photo goes through `upload`, one at a time.
 */
export function useFieldCheckDialog(units: { readonly value: UnitSystem }) {
  const model = ref<FieldCheckModel>(emptyFieldCheck());
  const result = ref<FieldCheckAnswer | null>(null);
  const photos = ref<File[]>([]);
  const photoProblem = ref<string | null>(null);
  const submission = useFieldCheckSubmit(model, units);

  /** A fresh form, its hours set to the job's planned hours where there is a job. */
  function reset(plannedHours: number | null = null) {
    model.value = emptyFieldCheck(plannedHours);
    result.value = null;
    photos.value = [];
    photoProblem.value = null;
    submission.clear();
  }

  function log(send: (body: FieldCheckBody) => Promise<FieldCheckAnswer>, upload: (answer: FieldCheckAnswer, file: File, index: number) => Promise<unknown>, onLogged: (answer: FieldCheckAnswer) => void) {
    return submission.submit(async () => {
      const answer = await send(fieldCheckSchema.parse(fieldCheckBody(model.value, units.value)));
      // The check is stored; a photo that fails to go is said so, and the check stays. The result
      // shows once the photos have gone, so that closing the form cannot cut an upload short.
      for (const [i, file] of photos.value.entries()) {
        try {
          await upload(answer, file, i);
        } catch (cause) {
          photoProblem.value = `The check is logged, but a photo was not sent: ${errorMessage(cause)}`;
        }
      }
      result.value = answer;
      onLogged(answer);
    });
  }

  return { model, result, photos, photoProblem, submission, reset, log };
}
