import type { MailOutboxAnswer, MailOutboxRow } from '@swardwise/domain';
import { api } from './client.ts';

export function getMailOutbox(signal?: AbortSignal): Promise<MailOutboxAnswer> {
  return api.get<MailOutboxAnswer>('/mail-outbox', undefined, signal);
}

export function retryMail(id: number): Promise<{ mail: MailOutboxRow }> {
  return api.post<{ mail: MailOutboxRow }>(`/mail-outbox/${id}/retry`);
}
