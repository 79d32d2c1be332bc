import { type ExecutionContext, HttpException, HttpStatus, Injectable } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail } from '@nestjs/throttler';
import type { Response } from 'express';

export const TOO_MANY_SIGN_INS_MESSAGE = 'Too many sign-in attempts; wait a minute and try again';

/** The e-mail a sign-in names, as the accounts are keyed (trimmed, lower case). */
export function signInEmail(req: Record<string, unknown>): string {
  const body = (req.body ?? {}) as { email?: unknown };
  return typeof body.email === 'string' ? body.email.trim().toLowerCase() : '';
}

/**
 * Who each sign-in limit counts (the throttlers are named in auth.module.ts):
 * - per address and e-mail: guessing one account's password from one place;
 * - per e-mail from anywhere: the same guess spread over many addresses;
 * - per address whatever the e-mail: trying many accounts from one place, at a higher limit so
 *   a control room behind one address can still sign in at shift change.
 * The address is Express's `req.ip`, which believes X-Forwarded-For only from TRUST_PROXY.
 */
export const SIGN_IN_TRACKERS = {
  'login': (req: Record<string, unknown>) => `${String(req.ip)}|${signInEmail(req)}`,
  'login-email': (req: Record<string, unknown>) => `email|${signInEmail(req)}`,
  'login-address': (req: Record<string, unknown>) => `address|${String(req.ip)}`,
} as const;

/** Rate-limits sign-in (see SIGN_IN_TRACKERS); a 429 says in Retry-After when to try again. */
@Injectable()
export class LoginThrottlerGuard extends ThrottlerGuard {
  protected override async throwThrottlingException(context: ExecutionContext, detail: ThrottlerLimitDetail): Promise<void> {
    const seconds = Math.max(1, Math.ceil(detail.timeToBlockExpire));
    context.switchToHttp().getResponse<Response>().setHeader('Retry-After', String(seconds));
    throw new HttpException(TOO_MANY_SIGN_INS_MESSAGE, HttpStatus.TOO_MANY_REQUESTS);
  }
}
