import { HttpException, HttpStatus, Injectable } from '@nestjs/common';
import { ThrottlerGuard } from '@nestjs/throttler';

/**
 * Rate-limits sign-in per address and e-mail, so that guessing one account's password is slowed
 * without locking out a whole control room behind one NAT address.
 */
@Injectable()
export class LoginThrottlerGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    const body = (req.body ?? {}) as { email?: unknown };
    const email = typeof body.email === 'string' ? body.email.trim().toLowerCase() : '';
    return `${String(req.ip)}|${email}`;
  }

  protected override async throwThrottlingException(): Promise<void> {
    throw new HttpException('Too many sign-in attempts; wait a minute and try again', HttpStatus.TOO_MANY_REQUESTS);
  }
}
