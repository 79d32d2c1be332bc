import { ConnectionException } from '@mikro-orm/core';
import { HttpStatus } from '@nestjs/common';
import { DATABASE_UNAVAILABLE_MESSAGE } from '@morrowline/shared';
import { RetryLaterException } from './http/retry-later.exception';

/** What a client is told while the database cannot be reached: no driver message, no address. */
export { DATABASE_UNAVAILABLE_MESSAGE };

/** Socket and driver error codes that mean "the database is not there", not "the query was wrong". */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_SOCKET_TIMEOUT',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_POOL_ALREADY_CLOSED',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
]);

/**
 * Whether an error says the database cannot be reached (down, restarting, network gone), as
 * opposed to a query it refused. SQLSTATE class 08 is "connection exception" (ISO/IEC 9075).
 * The driver's error may be wrapped by the ORM, so causes are followed.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let current = error, depth = 0; current && typeof current === 'object' && depth < 5; depth++) {
    if (current instanceof ConnectionException) return true;
    const { code, sqlState } = current as { code?: unknown; sqlState?: unknown };
    if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true;
    if (typeof sqlState === 'string' && sqlState.startsWith('08')) return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}

/** 503 with Retry-After: the request may succeed as it is once the database is back. */
export class DatabaseUnavailableException extends RetryLaterException {
  constructor() {
    super(HttpStatus.SERVICE_UNAVAILABLE, DATABASE_UNAVAILABLE_MESSAGE, 5);
  }
}
