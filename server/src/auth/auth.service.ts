import { Injectable, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import type { LoginResponse } from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AccessTokenPayload, AuthUser } from '../common/auth-user';
import type { AppConfig } from '../config/configuration';
import { decoyHash, verifyPassword } from '../users/password';
import { toUserDto, UsersService } from '../users/users.service';
import { PasswordCheckGate } from './password-check-gate';

/** One answer for every failed sign-in: it never says whether the e-mail or the password was wrong. */
const BAD_CREDENTIALS = 'E-mail or password is not right';

@Injectable()
export class AuthService {
  private readonly passwordChecks: PasswordCheckGate;

  constructor(
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly audit: AuditService,
    private readonly config: ConfigService,
  ) {
    const { concurrency, queue } = config.getOrThrow<AppConfig>('app').passwordChecks;
    this.passwordChecks = new PasswordCheckGate(concurrency, queue);
  }

  async login(email: string, password: string, address: string): Promise<LoginResponse> {
    const user = await this.users.findForLogin(email);
    const ok = await this.passwordChecks.run(async () => verifyPassword(user ? user.passwordHash : await decoyHash(), password));
    if (!user || !ok || !user.active) {
      await this.audit.record(user ? { id: user.id, email: user.email } : null, {
        action: 'auth.login-failed',
        subjectType: 'user',
        subjectId: user?.id ?? null,
        after: { email: email.toLowerCase(), address, reason: !user ? 'unknown-email' : !ok ? 'wrong-password' : 'inactive' },
      });
      throw new UnauthorizedException(BAD_CREDENTIALS);
    }
    const { expiresInSeconds } = this.config.getOrThrow<AppConfig>('app').jwt;
    const payload: AccessTokenPayload = { sub: user.id, email: user.email, role: user.role, sv: user.sessionVersion };
    const accessToken = await this.jwt.signAsync(payload, { expiresIn: expiresInSeconds });
    const updated = await this.users.touchLastLogin(user.id);
    await this.audit.record({ id: user.id, email: user.email }, {
      action: 'auth.login',
      subjectType: 'user',
      subjectId: user.id,
      after: { address },
    });
    return { accessToken, tokenType: 'Bearer', expiresIn: expiresInSeconds, user: toUserDto(updated) };
  }

  /** Ends the user's sessions (every token issued so far, on every desk) and records it. */
  async logout(user: AuthUser): Promise<void> {
    await this.users.endSessions(user.id);
    await this.audit.record({ id: user.id, email: user.email }, { action: 'auth.logout', subjectType: 'user', subjectId: user.id });
  }
}
