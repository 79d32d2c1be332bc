import { type ArgumentsHost, Catch, type ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Request, Response } from 'express';
import { STATUS_CODES } from 'node:http';
import type { ApiError } from '@morrowline/shared';
import { DatabaseUnavailableException, isDatabaseUnavailable } from '../database-unavailable';
import { retryAfterOf } from '../http/retry-later.exception';

/**
 * Every failed API call answers with one JSON shape (ApiError). Unexpected errors are logged in
 * full and answered with a plain 500 that leaks no internals.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('ApiError');

  catch(exception: unknown, host: ArgumentsHost): void {
    if (host.getType() !== 'http') throw exception;
    const context = host.switchToHttp();
    const request = context.getRequest<Request>();
    const response = context.getResponse<Response>();
    // A database outage is a 503 the client can wait out, never a 500 or a driver message.
    const unreachable = !(exception instanceof HttpException) && isDatabaseUnavailable(exception);
    const answered = unreachable ? new DatabaseUnavailableException() : exception;
    const body = toApiError(answered, request.originalUrl ?? request.url);
    if (unreachable) this.logger.error(`database unreachable: ${exception instanceof Error ? exception.message : String(exception)}`);
    else if (body.statusCode >= 500 && body.statusCode !== 503) this.logger.error(exception instanceof Error ? exception.stack : String(exception));
    if ((body.statusCode === 429 || body.statusCode === 503) && !response.getHeader('Retry-After')) {
      response.setHeader('Retry-After', String(retryAfterOf(answered)));
    }
    response.status(body.statusCode).json(body);
  }
}

export function toApiError(exception: unknown, path: string): ApiError {
  const timestamp = new Date().toISOString();
  if (exception instanceof HttpException) {
    const statusCode = exception.getStatus();
    const raw = exception.getResponse();
    let message = exception.message;
    let details: string[] | undefined;
    if (typeof raw === 'object' && raw !== null) {
      const candidate = (raw as { message?: unknown }).message;
      if (Array.isArray(candidate)) {
        details = candidate.map(String);
        message = 'The request is not valid';
      } else if (typeof candidate === 'string') {
        message = candidate;
      }
      const extra = (raw as { details?: unknown }).details;
      if (Array.isArray(extra)) details = extra.map(String);
    } else if (typeof raw === 'string') {
      message = raw;
    }
    return { statusCode, error: STATUS_CODES[statusCode] ?? 'Error', message, ...(details ? { details } : {}), path, timestamp };
  }
  const statusCode = HttpStatus.INTERNAL_SERVER_ERROR;
  return { statusCode, error: STATUS_CODES[statusCode]!, message: 'Something went wrong on the server; it has been logged', path, timestamp };
}
