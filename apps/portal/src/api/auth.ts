import type { ForgotPasswordAnswer, SessionAnswer, UnitSystem } from '@swardwise/domain';
import { api } from './client.ts';

export function getMe(): Promise<SessionAnswer> {
  return api.get<SessionAnswer>('/auth/me');
}

export function signIn(email: string, password: string): Promise<SessionAnswer> {
  return api.post<SessionAnswer>('/auth/sign-in', { email, password });
}

export async function signOut(): Promise<void> {
  await api.post<void>('/auth/sign-out');
}

export function updateMe(patch: { version: number; name?: string; units?: UnitSystem }): Promise<SessionAnswer> {
  return api.patch<SessionAnswer>('/auth/me', patch);
}

export function acceptInvite(token: string, password: string): Promise<SessionAnswer> {
  return api.post<SessionAnswer>('/auth/accept-invite', { token, password });
}

export function resetPassword(token: string, password: string): Promise<SessionAnswer> {
  return api.post<SessionAnswer>('/auth/reset-password', { token, password });
}

export async function forgotPassword(email: string): Promise<string> {
  return (await api.post<ForgotPasswordAnswer>('/auth/forgot-password', { email })).message;
}
