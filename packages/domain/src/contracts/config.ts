/** `GET /api/config`: what the API tells anyone, signed in or not, before sign-in. */
import type { Role } from '../vocabulary.ts';

/** One published sign-in of the invented demo city. */
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

export interface PublicConfig {
  /** Null unless the server runs in demo mode with the demo city loaded. */
  demo: DemoAnnouncement | null;
}
