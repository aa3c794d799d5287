import type { ColumnFiltersState } from '@tanstack/vue-table';
import { useRoute } from 'vue-router';

/** Column filters taken from the page's query (`/fields?district=North`), read once on open. */
export function useQueryFilters(columns: string[]): ColumnFiltersState {
  const query = useRoute().query;
  return columns.flatMap((id) => {
    const raw = query[id];
    if (typeof raw !== 'string' || raw === '') return [];
    return [{ id, value: /^\d+$/.test(raw) ? Number(raw) : raw }];
  });
}
