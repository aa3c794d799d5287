import type { Actor } from '../abilities.ts';
import type { Role, UnitSystem } from '../vocabulary.ts';
import type { Instant } from './common.ts';

/** The signed-in person: `GET /api/auth/me`, and the answer of sign-in and its siblings. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  districtId: number | null;
  crewId: number | null;
  siteIds: number[];
  units: UnitSystem;
  version: number;
}

/** `{ user, timeZone }`: sign-in, accept-invite, reset-password, `GET|PATCH /api/auth/me`. */
export interface SessionAnswer {
  user: SessionUser;
  /** The department's IANA time zone: "today" and week boundaries are local dates there. */
  timeZone: string;
}

/** `POST /api/auth/forgot-password` (202, the same whether or not the account exists). */
export interface ForgotPasswordAnswer {
  message: string;
}

/** A row of `GET /api/users`, and the user of `PATCH /api/users/:id`. */
export interface UserRow<At extends Instant = string> extends SessionUser {
  active: boolean;
  lastSignInAt: At | null;
  createdAt: At;
  districtName: string | null;
  crewName: string | null;
  /** Invited, and no password chosen yet. */
  pendingInvite: boolean;
}

/** `PATCH /api/users/:id`. */
export interface UserAnswer<At extends Instant = string> {
  user: UserRow<At>;
}

/** What `inviteUser` gives the route: the new account and its one-time link. */
export interface Invitation<At extends Instant = string> {
  user: UserRow<At>;
  inviteUrl: string;
}

/**
 * What became of an e-mail: `sent`; `off` when the server has no mail set up (SMTP_HOST), so
 * nothing can be mailed; `failed` when the mail server refused or could not be reached.
 */
export type MailStatus = 'sent' | 'off' | 'failed';

/** `POST /api/users` (201): the invitation, whether the e-mail went out and, if not, why. */
export interface InviteAnswer<At extends Instant = string> extends Invitation<At> {
  emailed: boolean;
  mail: MailStatus;
}

/** The scope a session user acts with; the API and the portal build the same abilities from it. */
export function actorOf(user: SessionUser): Actor {
  return { id: user.id, role: user.role, districtId: user.districtId, crewId: user.crewId, siteIds: user.siteIds };
}
