import type { CreateSiteInput, SiteAnswer, SiteDetailAnswer, SiteList, SiteRow, UpdateSiteInput } from '@swardwise/domain';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

export async function listSites(query: { districtId?: number } = {}, signal?: AbortSignal): Promise<SiteRow[]> {
  return (await api.get<SiteList>('/sites', query, signal)).items;
}

/** The site with its fields. */
export function getSite(id: number, signal?: AbortSignal): Promise<SiteDetailAnswer> {
  return api.get<SiteDetailAnswer>(`/sites/${id}`, undefined, signal);
}

const writes = rowWrites<SiteAnswer, CreateSiteInput, UpdateSiteInput>('sites', 'site');
export const { create: createSite, update: updateSite } = writes;
