import type { InviteAnswer, InviteUserInput, UpdateUserInput, UserAnswer, UserRow, Items } from '@swardwise/domain';
import { api } from './client.ts';

export async function listUsers(signal?: AbortSignal): Promise<UserRow[]> {
  return (await api.get<Items<UserRow>>('/users', undefined, signal)).items;
}

/** Creates the account and its one-time link; the API also e-mails it. */
export function inviteUser(input: InviteUserInput): Promise<InviteAnswer> {
  return api.post<InviteAnswer>('/users', input);
}

export async function updateUser(id: number, patch: UpdateUserInput): Promise<UserRow> {
  return (await api.patch<UserAnswer>(`/users/${id}`, patch)).user;
}
