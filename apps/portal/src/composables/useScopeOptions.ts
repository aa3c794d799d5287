import { computed } from 'vue';
import { useCrews } from './useCrews.ts';
import { useDistricts } from './useDistricts.ts';
import { useSites } from './useSites.ts';

/** The districts, crews and sites a user can be bound to, for the user forms. */
export function useScopeOptions() {
  const districts = useDistricts();
  const crews = useCrews();
  const sites = useSites();
  return {
    districts: computed(() => districts.data.value ?? []),
    crews: computed(() => crews.data.value ?? []),
    sites: computed(() => sites.data.value ?? []),
    loading: computed(() => districts.loading.value || crews.loading.value || sites.loading.value),
    error: computed(() => districts.error.value ?? crews.error.value ?? sites.error.value),
  };
}

export type ScopeOptions = ReturnType<typeof useScopeOptions>;
