import type { DevMailAnswer } from '@swardwise/domain';
import { api } from './client.ts';

/** What the development mail sink received (the route exists only when the API runs one). */
export function listDevMail(signal?: AbortSignal): Promise<DevMailAnswer> {
  return api.get<DevMailAnswer>('/dev/mail', undefined, signal);
}

/** Empties the sink. */
export async function removeDevMail(): Promise<void> {
  await api.delete<void>('/dev/mail');
}
