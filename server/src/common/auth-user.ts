import type { Role } from '@morrowline/shared';

/** The signed-in user as guards and controllers see it (request.user). */
export interface AuthUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

/** What the access token carries. The role is re-read from the database on every request. */
export interface AccessTokenPayload {
  sub: number;
  email: string;
  role: Role;
  /** The user's session version at sign-in; a sign-out raises it and ends this token. */
  sv: number;
  /** Expiry, seconds since the epoch (set by the signer). */
  exp?: number;
}
