import { Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Role } from '@morrowline/shared';
import type { AccessTokenPayload, AuthUser } from '../common/auth-user';
import { UsersService } from '../users/users.service';

/**
 * Checks the access token a desk presents when its socket connects (handshake `auth.token`).
 * The same rules as HTTP: a valid, unexpired token of an active user with an allowed role.
 */
@Injectable()
export class SocketAuthService {
  constructor(
    private readonly jwt: JwtService,
    private readonly users: UsersService,
  ) {}

  async authenticate(token: unknown, allowed: readonly Role[]): Promise<AuthUser> {
    if (typeof token !== 'string' || token.length === 0) throw new Error('Sign in to use this');
    let payload: AccessTokenPayload;
    try {
      payload = await this.jwt.verifyAsync<AccessTokenPayload>(token, { algorithms: ['HS256'] });
    } catch {
      throw new Error('Your session has expired; sign in again');
    }
    const user = await this.users.findActiveById(payload.sub);
    if (!user) throw new Error('Your account is no longer active');
    if (!allowed.includes(user.role)) throw new Error(`Your role (${user.role}) may not do this`);
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }
}
