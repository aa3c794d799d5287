import { toValue, type MaybeRefOrGetter } from 'vue';
import { getPartnerField, listPartnerFields } from '../api/partner.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** The partner's fields in plain words (`GET /api/partner/fields`). */
export function usePartnerFields() {
  return useApiQuery(() => queryKeys.partnerFields(), (signal) => listPartnerFields(signal));
}

/** One of the partner's fields (`GET /api/partner/fields/:id`). */
export function usePartnerField(id: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.partnerField(toValue(id)), (signal) => getPartnerField(toValue(id), signal));
}
