import type { ForgotPasswordAnswer, SessionAnswer, SessionUser, UnitSystem } from '@swardwise/domain';
import { api } from './client.ts';

export async function getMe(): Promise<SessionUser> {
  return (await api.get<SessionAnswer>('/auth/me')).user;
}

export async function signIn(email: string, password: string): Promise<SessionUser> {
  return (await api.post<SessionAnswer>('/auth/sign-in', { email, password })).user;
}

export async function signOut(): Promise<void> {
  await api.post<void>('/auth/sign-out');
}

export async function updateMe(patch: { version: number; name?: string; units?: UnitSystem }): Promise<SessionUser> {
  return (await api.patch<SessionAnswer>('/auth/me', patch)).user;
}

export async function acceptInvite(token: string, password: string): Promise<SessionUser> {
  return (await api.post<SessionAnswer>('/auth/accept-invite', { token, password })).user;
}

export async function resetPassword(token: string, password: string): Promise<SessionUser> {
  return (await api.post<SessionAnswer>('/auth/reset-password', { token, password })).user;
}

export async function forgotPassword(email: string): Promise<string> {
  return (await api.post<ForgotPasswordAnswer>('/auth/forgot-password', { email })).message;
}
