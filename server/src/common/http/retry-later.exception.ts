import { HttpException, HttpStatus } from '@nestjs/common';

/** Seconds a client is told to wait when no more precise figure is known. */
export const DEFAULT_RETRY_AFTER_SECONDS = 5;

/**
 * A 429 or 503 that says when to try again: the error filter sends `retryAfterSeconds` as the
 * Retry-After header (RFC 9110 §10.2.3), which every 429 and 503 of the API carries.
 */
export class RetryLaterException extends HttpException {
  constructor(
    status: HttpStatus.TOO_MANY_REQUESTS | HttpStatus.SERVICE_UNAVAILABLE,
    message: string,
    readonly retryAfterSeconds: number = DEFAULT_RETRY_AFTER_SECONDS,
  ) {
    super(message, status);
  }
}

/** The Retry-After seconds of an exception answered with 429 or 503. */
export function retryAfterOf(exception: unknown): number {
  return exception instanceof RetryLaterException ? Math.max(1, Math.ceil(exception.retryAfterSeconds)) : DEFAULT_RETRY_AFTER_SECONDS;
}
