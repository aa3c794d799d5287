import type { CreateSiteInput, UpdateSiteInput } from '@swardwise/domain';
import { api } from './client.ts';
import type { FieldRow, Items, SiteRow } from './types.ts';

export async function listSites(query: { districtId?: number } = {}, signal?: AbortSignal): Promise<SiteRow[]> {
  return (await api.get<Items<SiteRow>>('/sites', query, signal)).items;
}

export async function getSite(id: number, signal?: AbortSignal): Promise<{ site: SiteRow; fields: FieldRow[] }> {
  return api.get<{ site: SiteRow; fields: FieldRow[] }>(`/sites/${id}`, undefined, signal);
}

export async function createSite(input: CreateSiteInput): Promise<SiteRow> {
  return (await api.post<{ site: SiteRow }>('/sites', input)).site;
}

export async function updateSite(id: number, input: UpdateSiteInput): Promise<SiteRow> {
  return (await api.patch<{ site: SiteRow }>(`/sites/${id}`, input)).site;
}
