import { asSubject, type MapField, type MapSite } from '@swardwise/domain';
import { computed } from 'vue';
import { ability } from '../ability.ts';
import { getBasemap, getMap } from '../api/map.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export interface SearchHit {
  value: string;
  kind: 'field' | 'site';
  id: number;
  detail: string;
}

/** The map answer, the basemap, a name search and what the caller may change on the map. */
export function useMapData() {
  const map = useApiQuery(queryKeys.map(), getMap);
  const basemap = useApiQuery(queryKeys.basemap(), getBasemap);

  const sitesById = computed(() => new Map((map.data.value?.sites ?? []).map((s) => [s.id, s])));
  /** Sites the caller may add a field to: the ability decides, as the API will. */
  const writableSites = computed<MapSite[]>(() =>
    (map.data.value?.sites ?? []).filter((s) => ability.can('create', asSubject('Field', { siteId: s.id, districtId: s.districtId }))),
  );
  const canEdit = (f: MapField) => ability.can('update', asSubject('Field', { id: f.id, siteId: f.siteId, districtId: f.districtId }));
  const canDelete = (f: MapField) => ability.can('delete', asSubject('Field', { id: f.id, siteId: f.siteId, districtId: f.districtId }));

  /** Fields and sites whose name contains the words typed, fields first; at most 12. */
  function search(query: string): SearchHit[] {
    const q = query.trim().toLowerCase();
    const data = map.data.value;
    if (!q || !data) return [];
    const fields = data.fields
      .filter((f) => f.name.toLowerCase().includes(q) || (sitesById.value.get(f.siteId)?.name.toLowerCase().includes(q) ?? false))
      .map((f) => ({ value: f.name, kind: 'field' as const, id: f.id, detail: sitesById.value.get(f.siteId)?.name ?? '' }));
    const sites = data.sites.filter((s) => s.name.toLowerCase().includes(q)).map((s) => ({ value: s.name, kind: 'site' as const, id: s.id, detail: 'site' }));
    return [...sites, ...fields].slice(0, 12);
  }

  return { map, basemap, sitesById, writableSites, canEdit, canDelete, search };
}
