import { api } from './client.ts';

export interface SinkMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** What the development mail sink received (the route exists only when the API runs one). */
export async function fetchDevMail(signal?: AbortSignal): Promise<{ port: number | null; items: SinkMessage[] }> {
  return api.get('/dev/mail', undefined, signal);
}

export async function clearDevMail(): Promise<void> {
  await api.delete<void>('/dev/mail');
}
