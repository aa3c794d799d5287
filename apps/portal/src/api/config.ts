import type { PublicConfig } from '@swardwise/domain';
import { api } from './client.ts';

/** What the API tells anyone, signed in or not (the demo announcement). */
export async function getPublicConfig(): Promise<PublicConfig> {
  return api.get<PublicConfig>('/config');
}
