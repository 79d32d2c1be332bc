import { BadRequestException, ForbiddenException, HttpException } from '@nestjs/common';
import { RetryLaterException } from '../http/retry-later.exception';
import { ApiExceptionFilter, toApiError } from './api-exception.filter';

describe('toApiError', () => {
  it('turns validation messages into details under one sentence', () => {
    const error = toApiError(new BadRequestException(['email must be an e-mail address', 'property x should not exist']), '/api/users');
    expect(error.statusCode).toBe(400);
    expect(error.error).toBe('Bad Request');
    expect(error.message).toBe('The request is not valid');
    expect(error.details).toEqual(['email must be an e-mail address', 'property x should not exist']);
    expect(error.path).toBe('/api/users');
  });

  it('keeps a plain message', () => {
    const error = toApiError(new ForbiddenException('Your role (viewer) may not do this'), '/api/users');
    expect(error).toMatchObject({ statusCode: 403, error: 'Forbidden', message: 'Your role (viewer) may not do this' });
    expect(error.details).toBeUndefined();
  });

  it('hides the internals of unexpected errors', () => {
    const error = toApiError(new Error('ER_ACCESS_DENIED for user root at 10.0.0.1'), '/api/zones');
    expect(error.statusCode).toBe(500);
    expect(error.message).not.toContain('root');
  });
});

describe('ApiExceptionFilter', () => {
  function answer(exception: unknown) {
    const headers: Record<string, string> = {};
    let status = 0;
    let body: unknown;
    const response = {
      getHeader: (name: string) => headers[name],
      setHeader: (name: string, value: string) => (headers[name] = value),
      status: (code: number) => ((status = code), response),
      json: (payload: unknown) => (body = payload),
    };
    const host = { getType: () => 'http', switchToHttp: () => ({ getRequest: () => ({ url: '/api/zones' }), getResponse: () => response }) };
    new ApiExceptionFilter().catch(exception, host as never);
    return { status, headers, body: body as { message: string } };
  }

  it('answers a database that cannot be reached with 503 and Retry-After, without the driver message or address', () => {
    const refused = Object.assign(new Error('connect ECONNREFUSED 10.20.30.40:3306'), { code: 'ECONNREFUSED' });
    const { status, headers, body } = answer(refused);
    expect(status).toBe(503);
    expect(Number(headers['Retry-After'])).toBeGreaterThan(0);
    expect(body.message).toBe('The server cannot reach its database; try again shortly');
    expect(JSON.stringify(body)).not.toContain('10.20.30.40');
  });

  it('follows the cause of a wrapped driver error (SQLSTATE 08: connection exception)', () => {
    const wrapped = new Error('query failed', { cause: Object.assign(new Error('socket closed'), { sqlState: '08S01' }) });
    expect(answer(wrapped).status).toBe(503);
  });

  it('puts Retry-After on every 429', () => {
    expect(answer(new HttpException('slow down', 429)).headers['Retry-After']).toBe('5');
    expect(answer(new RetryLaterException(429, 'slow down', 30)).headers['Retry-After']).toBe('30');
  });

  it('keeps other unexpected errors a 500 without Retry-After', () => {
    const { status, headers } = answer(Object.assign(new Error('ER_PARSE_ERROR near x'), { code: 'ER_PARSE_ERROR', sqlState: '42000' }));
    expect(status).toBe(500);
    expect(headers['Retry-After']).toBeUndefined();
  });
});
