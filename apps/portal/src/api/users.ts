import type { InviteUserInput, UpdateUserInput } from '@swardwise/domain';
import { api } from './client.ts';
import type { Items, UserRow } from './types.ts';

export async function listUsers(signal?: AbortSignal): Promise<UserRow[]> {
  return (await api.get<Items<UserRow>>('/users', undefined, signal)).items;
}

export async function inviteUser(input: InviteUserInput): Promise<{ user: UserRow; inviteUrl: string }> {
  return api.post<{ user: UserRow; inviteUrl: string }>('/users', input);
}

export async function updateUser(id: number, patch: UpdateUserInput): Promise<UserRow> {
  return (await api.patch<{ user: UserRow }>(`/users/${id}`, patch)).user;
}
