import { toValue, type MaybeRefOrGetter } from 'vue';
import { getFieldLinePlan } from '../api/linePlans.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** A field's line plan and what its figures are worked out from. */
export function useFieldLinePlan(fieldId: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.fieldLinePlan(toValue(fieldId)), (signal) => getFieldLinePlan(toValue(fieldId), signal));
}
