import type { CompareQuery, CompareSitesAnswer } from '@swardwise/domain';
import { api } from './client.ts';

export function getSiteComparison(query: Partial<CompareQuery>, signal?: AbortSignal): Promise<CompareSitesAnswer> {
  return api.get<CompareSitesAnswer>('/compare/sites', query, signal);
}

/** The address of the same comparison as a CSV file (the browser downloads it with the session cookie). */
export function siteComparisonCsvUrl(query: Partial<CompareQuery>): string {
  const params = new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]));
  return `/api/compare/sites.csv${params.size ? `?${params}` : ''}`;
}
