import type { AccessTokenPayload, AuthUser } from '../common/auth-user';
import { DatabaseUnavailableException, isDatabaseUnavailable } from '../common/database-unavailable';
import type { User } from '../users/entities/user.entity';

/** The messages a refused token gets, HTTP and socket alike. */
export const TOKEN_MESSAGES = {
  missing: 'Sign in to use this',
  expired: 'Your session has expired; sign in again',
  invalid: 'Your sign-in is not valid; sign in again',
  ended: 'Your session has ended; sign in again',
  inactive: 'Your account is no longer active',
} as const;

/** Why a verified token is no longer accepted, or null if it is. */
export function refusal(payload: AccessTokenPayload, user: User | null): string | null {
  if (!user) return TOKEN_MESSAGES.inactive;
  if (typeof payload.sv !== 'number' || payload.sv !== user.sessionVersion) return TOKEN_MESSAGES.ended;
  return null;
}

export function toAuthUser(user: User): AuthUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/**
 * Reads the token's user. A database that cannot be reached is a 503, never a refusal: the
 * token may be perfectly good, and a desk must not be signed out by an outage.
 */
export async function loadTokenUser(payload: AccessTokenPayload, find: (id: number) => Promise<User | null>): Promise<User | null> {
  try {
    return await find(payload.sub);
  } catch (error) {
    if (isDatabaseUnavailable(error)) throw new DatabaseUnavailableException();
    throw error;
  }
}
