import { Injectable, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { AccessTokenPayload, AuthUser } from '../common/auth-user';
import type { AppConfig } from '../config/configuration';
import { UsersService } from '../users/users.service';
import { loadTokenUser, refusal, toAuthUser } from './token-check';

/**
 * Bearer tokens signed with JWT_SECRET. The user is re-read on each request so that a
 * deactivation, a role change or a sign-out takes effect at once rather than when the token
 * expires. A database outage answers 503 (DatabaseUnavailableException), not 401.
 */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    config: ConfigService,
    private readonly users: UsersService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      ignoreExpiration: false,
      secretOrKey: config.getOrThrow<AppConfig>('app').jwt.secret,
      algorithms: ['HS256'],
    });
  }

  async validate(payload: AccessTokenPayload): Promise<AuthUser> {
    const user = await loadTokenUser(payload, (id) => this.users.findActiveById(id));
    const refused = refusal(payload, user);
    if (refused || !user) throw new UnauthorizedException(refused);
    return toAuthUser(user);
  }
}
