import type { Role } from './roles';

/**
 * The desks' live channel (socket.io). A desk connects to DESK_NAMESPACE with
 * `auth: { token: <access token> }`; a missing, expired or invalid token is refused.
 */
export const DESK_NAMESPACE = '/desk';

export const DESK_EVENTS = {
  hello: 'desk:hello',
} as const;

export interface DeskHello {
  user: { id: number; name: string; role: Role };
  serverTime: string;
}
