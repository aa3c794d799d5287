import { toValue, type MaybeRefOrGetter } from 'vue';
import { listFieldLogos } from '../api/logos.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** A field's logos with their grid and paint. */
export function useFieldLogos(fieldId: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.fieldLogos(toValue(fieldId)), (signal) => listFieldLogos(toValue(fieldId), signal));
}
