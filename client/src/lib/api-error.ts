import type { ApiError } from '@morrowline/shared';

/** A failed API call: the HTTP status and, when the server sent one, its ApiError body. */
export class ApiRequestError extends Error {
  readonly status: number;
  readonly details: string[];
  readonly body: ApiError | null;

  constructor(status: number, body: ApiError | null, fallbackMessage: string) {
    super(body?.message || fallbackMessage);
    this.name = 'ApiRequestError';
    this.status = status;
    this.body = body;
    this.details = body?.details ?? [];
  }
}

/** The server could not be reached at all (network down, server stopped). */
export class ApiUnreachableError extends Error {
  constructor(cause: unknown) {
    super('The Morrowline server could not be reached. Check the connection and try again.', { cause });
    this.name = 'ApiUnreachableError';
  }
}

export function isApiError(value: unknown): value is ApiError {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as ApiError).statusCode === 'number' &&
    typeof (value as ApiError).message === 'string'
  );
}

/** A title and lines for showing any error to a person. */
export function describeError(error: unknown): { message: string; details: string[] } {
  if (error instanceof ApiRequestError) return { message: error.message, details: error.details };
  if (error instanceof Error) return { message: error.message, details: [] };
  return { message: 'Something went wrong.', details: [] };
}
