import type { Role } from '@swardwise/domain';
import { api } from './client.ts';

export interface DemoSignIn {
  role: Role;
  label: string;
  email: string;
  password: string;
}

/** The server runs the invented demo city (demo mode only). */
export interface DemoAnnouncement {
  city: string;
  note: string;
  signIns: DemoSignIn[];
}

/** What the API tells anyone, signed in or not. */
export interface PublicConfig {
  demo: DemoAnnouncement | null;
}

export async function fetchPublicConfig(): Promise<PublicConfig> {
  return api.get<PublicConfig>('/config');
}
