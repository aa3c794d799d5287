import type { UnitSystem } from '@swardwise/domain';
import { api } from './client.ts';
import type { SessionUser } from './types.ts';

export async function fetchMe(): Promise<SessionUser> {
  return (await api.get<{ user: SessionUser }>('/auth/me')).user;
}

export async function signIn(email: string, password: string): Promise<SessionUser> {
  return (await api.post<{ user: SessionUser }>('/auth/sign-in', { email, password })).user;
}

export async function signOut(): Promise<void> {
  await api.post<void>('/auth/sign-out');
}

export async function updateMe(patch: { version: number; name?: string; units?: UnitSystem }): Promise<SessionUser> {
  return (await api.patch<{ user: SessionUser }>('/auth/me', patch)).user;
}

export async function acceptInvite(token: string, password: string): Promise<SessionUser> {
  return (await api.post<{ user: SessionUser }>('/auth/accept-invite', { token, password })).user;
}

export async function resetPassword(token: string, password: string): Promise<SessionUser> {
  return (await api.post<{ user: SessionUser }>('/auth/reset-password', { token, password })).user;
}

export async function forgotPassword(email: string): Promise<string> {
  return (await api.post<{ message: string }>('/auth/forgot-password', { email })).message;
}
