import type { CreateSiteInput, SiteAnswer, SiteDetailAnswer, SiteList, SiteRow, UpdateSiteInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listSites(query: { districtId?: number } = {}, signal?: AbortSignal): Promise<SiteRow[]> {
  return (await api.get<SiteList>('/sites', query, signal)).items;
}

/** The site with its fields. */
export function getSite(id: number, signal?: AbortSignal): Promise<SiteDetailAnswer> {
  return api.get<SiteDetailAnswer>(`/sites/${id}`, undefined, signal);
}

export async function createSite(input: CreateSiteInput): Promise<SiteRow> {
  return (await api.post<SiteAnswer>('/sites', input)).site;
}

export async function updateSite(id: number, input: UpdateSiteInput): Promise<SiteRow> {
  return (await api.patch<SiteAnswer>(`/sites/${id}`, input)).site;
}
