import { toValue, type MaybeRefOrGetter } from 'vue';
import { getFieldClosures, getStatusBoard } from '../api/closures.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** A field's closures: the decision in force, its history, the work closing would touch and the check's suggestion. */
export function useFieldClosures(fieldId: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.fieldClosures(toValue(fieldId)), (signal) => getFieldClosures(toValue(fieldId), signal));
}

export function useStatusBoard() {
  return useApiQuery(() => queryKeys.statusBoard(), (signal) => getStatusBoard(signal));
}
