import type { Overview, OverviewQuery } from '@swardwise/domain';
import { api } from './client.ts';

export function getOverview(query: OverviewQuery, signal?: AbortSignal): Promise<Overview> {
  return api.get<Overview>('/overview', query, signal);
}
