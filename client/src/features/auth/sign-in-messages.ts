import { ApiRequestError, describeError } from '../../lib/api-error';

export const WRONG_CREDENTIALS_MESSAGE = 'That e-mail and password do not match an active account.';
export const TOO_MANY_ATTEMPTS_MESSAGE = 'Too many attempts, wait a minute';
export const SESSION_EXPIRED_MESSAGE = 'Your session has expired, please sign in again';

/**
 * What the sign-in screen says when sign-in fails. A 401 gets one neutral sentence whatever
 * the server's reason, so the screen never tells which of the two fields was wrong.
 */
export function signInErrorMessage(error: unknown): string {
  if (error instanceof ApiRequestError) {
    if (error.status === 401 || error.status === 403) return WRONG_CREDENTIALS_MESSAGE;
    if (error.status === 429) return TOO_MANY_ATTEMPTS_MESSAGE;
  }
  return describeError(error).message;
}
