import { beforeEach, describe, expect, it, vi } from 'vitest';
import { apiError, mockApi } from '../test/mock-api';
import { createApiClient } from './api-client';
import { ApiRequestError, ApiUnreachableError } from './api-error';
import { createServerStatusStore } from './server-status';
import { createSessionStore, type SessionStore } from './session-store';

describe('api client', () => {
  let sessionStore: SessionStore;

  beforeEach(() => {
    window.sessionStorage.clear();
    sessionStore = createSessionStore();
  });

  it('sends the bearer token and parses the JSON answer', async () => {
    const { calls } = mockApi({ 'GET /api/zones': () => ({ body: [{ id: 1 }] }) });
    sessionStore.start('abc', 600);
    const api = createApiClient({ sessionStore });

    await expect(api.get('/zones')).resolves.toEqual([{ id: 1 }]);
    expect(calls[0].headers.Authorization).toBe('Bearer abc');
  });

  it('ends the session as expired when the server answers 401 to a request with a token', async () => {
    mockApi({ 'GET /api/users': () => ({ status: 401, body: apiError(401, 'Unauthorized', 'Token expired') }) });
    sessionStore.start('stale', 600);
    const api = createApiClient({ sessionStore });

    const failure = api.get('/users');
    await expect(failure).rejects.toBeInstanceOf(ApiRequestError);
    await expect(failure).rejects.toMatchObject({ status: 401 });
    expect(sessionStore.getSnapshot()).toEqual({ session: null, endReason: 'expired' });
  });

  it('leaves the session alone for a 401 on a request sent without a token (sign-in)', async () => {
    const { calls } = mockApi({
      'POST /api/auth/login': () => ({ status: 401, body: apiError(401, 'Unauthorized', 'Invalid credentials') }),
    });
    const listener = vi.fn();
    sessionStore.subscribe(listener);
    const api = createApiClient({ sessionStore });

    await expect(api.post('/auth/login', { email: 'a@b.c', password: 'x' }, { authenticated: false })).rejects.toMatchObject({
      status: 401,
      message: 'Invalid credentials',
    });
    expect(calls[0].headers.Authorization).toBeUndefined();
    expect(listener).not.toHaveBeenCalled();
    expect(sessionStore.getSnapshot().endReason).toBeNull();
  });

  it('does not end a newer session over a 401 to a request sent with an older token', async () => {
    let answer: (reply: { status: number; body: unknown }) => void = () => {};
    mockApi({ 'GET /api/zones': () => new Promise((resolve) => (answer = resolve)) });
    sessionStore.start('old', 600);
    const api = createApiClient({ sessionStore });

    const pending = api.get('/zones');
    await vi.waitFor(() => expect(fetch).toHaveBeenCalled());
    sessionStore.end('signed-out');
    sessionStore.start('new', 600);
    answer({ status: 401, body: apiError(401, 'Unauthorized', 'Token revoked') });

    await expect(pending).rejects.toMatchObject({ status: 401 });
    expect(sessionStore.token()).toBe('new');
  });

  it('keeps the session on a 403: the token is fine, the role is not', async () => {
    mockApi({ 'GET /api/users': () => ({ status: 403, body: apiError(403, 'Forbidden', 'Admins only') }) });
    sessionStore.start('viewer-token', 600);
    const api = createApiClient({ sessionStore });

    await expect(api.get('/users')).rejects.toMatchObject({ status: 403, message: 'Admins only' });
    expect(sessionStore.token()).toBe('viewer-token');
  });

  it('carries the ApiError message and details', async () => {
    mockApi({
      'POST /api/users': () => ({
        status: 400,
        body: apiError(400, 'Bad Request', 'Validation failed', ['email must be an email', 'password is too short']),
      }),
    });
    sessionStore.start('t', 600);
    const api = createApiClient({ sessionStore });

    const error = await api.post('/users', {}).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiRequestError);
    expect((error as ApiRequestError).message).toBe('Validation failed');
    expect((error as ApiRequestError).details).toEqual(['email must be an email', 'password is too short']);
  });

  it('leaves empty filters out of the query string', async () => {
    const { calls } = mockApi({ 'GET /api/audit': () => ({ body: { items: [], total: 0 } }) });
    sessionStore.start('t', 600);
    const api = createApiClient({ sessionStore });

    await api.get('/audit', { query: { limit: 50, offset: 0, action: '', subjectType: 'user' } });
    expect(calls[0].path).toBe('/api/audit?limit=50&offset=0&subjectType=user');
  });

  it('says so when the server cannot be reached', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    const api = createApiClient({ sessionStore });
    await expect(api.get('/health')).rejects.toBeInstanceOf(ApiUnreachableError);
  });

  it('keeps the session on a 503 "cannot reach its database" and reports the outage until an answer comes', async () => {
    let down = true;
    mockApi({
      'GET /api/zones': () =>
        down
          ? { status: 503, body: apiError(503, 'Service Unavailable', 'The server cannot reach its database; try again shortly') }
          : { body: [] },
    });
    sessionStore.start('good', 600);
    const serverStatus = createServerStatusStore();
    const api = createApiClient({ sessionStore, serverStatus });

    await expect(api.get('/zones')).rejects.toMatchObject({ status: 503 });
    expect(sessionStore.getSnapshot().session?.token).toBe('good');
    expect(serverStatus.getSnapshot()).toBe('database-down');

    down = false;
    await expect(api.get('/zones')).resolves.toEqual([]);
    expect(serverStatus.getSnapshot()).toBe('ok');
  });

  it('does not take another 503 (a busy sign-in) for a database outage', async () => {
    mockApi({ 'POST /api/auth/login': () => ({ status: 503, body: apiError(503, 'Service Unavailable', 'The server is busy checking other sign-ins; try again in a moment') }) });
    const serverStatus = createServerStatusStore();
    const api = createApiClient({ sessionStore, serverStatus });
    await expect(api.post('/auth/login', { email: 'a@b.c', password: 'x' }, { authenticated: false })).rejects.toMatchObject({ status: 503 });
    expect(serverStatus.getSnapshot()).toBe('ok');
  });
});
