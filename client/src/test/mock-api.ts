import { vi } from 'vitest';

export interface MockRequest {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

export interface MockReply {
  status?: number;
  body?: unknown;
}

type Handler = (request: MockRequest) => MockReply | Promise<MockReply>;

/**
 * Replaces fetch with a table of "METHOD /path" handlers (path without the query string) and
 * records every call, so a test can check both what the screen shows and what it sent.
 * Anything not in the table answers 404 in the server's ApiError shape.
 */
export function mockApi(handlers: Record<string, Handler>) {
  const calls: MockRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://desk.test');
    const method = (init?.method ?? 'GET').toUpperCase();
    const request: MockRequest = {
      method,
      path: url.pathname + url.search,
      headers: { ...(init?.headers as Record<string, string> | undefined) },
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    calls.push(request);
    const handler = handlers[`${method} ${url.pathname}`];
    const reply: MockReply = handler
      ? await handler(request)
      : { status: 404, body: apiError(404, 'Not Found', `No mock for ${method} ${url.pathname}`) };
    const status = reply.status ?? 200;
    return new Response(reply.body === undefined ? null : JSON.stringify(reply.body), {
      status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, fetchMock };
}

export function apiError(statusCode: number, error: string, message: string, details?: string[]) {
  return { statusCode, error, message, details, path: '/api/test', timestamp: new Date(0).toISOString() };
}
