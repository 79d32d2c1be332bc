import { BadRequestException, ForbiddenException } from '@nestjs/common';
import { toApiError } from './api-exception.filter';

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
