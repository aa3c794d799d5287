import { toValue, type MaybeRefOrGetter } from 'vue';
import { getFieldStripes } from '../api/stripes.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** A field's stripe pattern and the mowers its pass plan may be worked out for. */
export function useFieldStripes(fieldId: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.fieldStripes(toValue(fieldId)), (signal) => getFieldStripes(toValue(fieldId), signal));
}
