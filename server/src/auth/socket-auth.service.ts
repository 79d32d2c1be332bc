import { HttpException, Injectable, Logger } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Role } from '@morrowline/shared';
import type { AccessTokenPayload, AuthUser } from '../common/auth-user';
import { DATABASE_UNAVAILABLE_MESSAGE } from '../common/database-unavailable';
import { UsersService } from '../users/users.service';
import { loadTokenUser, refusal, TOKEN_MESSAGES, toAuthUser } from './token-check';

/** A socket that passed the check: who it is and when its token runs out (epoch ms). */
export interface SocketSession {
  user: AuthUser;
  expiresAt: number;
}

/**
 * Checks the access token a desk presents when its socket connects (handshake `auth.token`).
 * The same rules as HTTP: a valid, unexpired, not signed-out token of an active user with an
 * allowed role. Every refusal is one of our own sentences: a handshake error reaches clients
 * that have not signed in, so no driver message or address may pass.
 */
@Injectable()
export class SocketAuthService {
  private readonly logger = new Logger(SocketAuthService.name);

  constructor(
    private readonly jwt: JwtService,
    private readonly users: UsersService,
  ) {}

  async authenticate(token: unknown, allowed: readonly Role[]): Promise<SocketSession> {
    if (typeof token !== 'string' || token.length === 0) throw new Error(TOKEN_MESSAGES.missing);
    let payload: AccessTokenPayload;
    try {
      payload = await this.jwt.verifyAsync<AccessTokenPayload>(token, { algorithms: ['HS256'] });
    } catch (error) {
      throw new Error(error instanceof Error && error.name === 'TokenExpiredError' ? TOKEN_MESSAGES.expired : TOKEN_MESSAGES.invalid, { cause: error });
    }
    let user;
    try {
      user = await loadTokenUser(payload, (id) => this.users.findActiveById(id));
    } catch (error) {
      this.logger.warn(`socket sign-in check failed: ${error instanceof Error ? error.message : String(error)}`);
      // socket.io passes only the message (and `data`) to the client, never the cause.
      throw new Error(error instanceof HttpException && error.getStatus() === 503 ? DATABASE_UNAVAILABLE_MESSAGE : 'The server could not check your sign-in; try again', {
        cause: error,
      });
    }
    const refused = refusal(payload, user);
    if (refused || !user) throw new Error(refused ?? TOKEN_MESSAGES.inactive);
    if (!allowed.includes(user.role)) throw new Error(`Your role (${user.role}) may not do this`);
    return { user: toAuthUser(user), expiresAt: (payload.exp ?? 0) * 1000 };
  }
}
