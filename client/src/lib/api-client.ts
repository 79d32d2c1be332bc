import { DATABASE_UNAVAILABLE_MESSAGE } from '@morrowline/shared';
import { isApiError, ApiRequestError, ApiUnreachableError } from './api-error';
import { serverStatusStore as defaultServerStatus, type ServerStatusStore } from './server-status';
import { sessionStore as defaultSessionStore, type SessionStore } from './session-store';

export type QueryValue = string | number | boolean | null | undefined;

export interface RequestOptions {
  body?: unknown;
  query?: Record<string, QueryValue>;
  signal?: AbortSignal;
  /** Send the bearer token (default). Sign-in itself goes without one. */
  authenticated?: boolean;
}

export interface ApiClientOptions {
  sessionStore?: SessionStore;
  serverStatus?: ServerStatusStore;
  fetch?: typeof fetch;
  baseUrl?: string;
}

export function createApiClient({
  sessionStore = defaultSessionStore,
  serverStatus = defaultServerStatus,
  fetch: fetchImpl,
  baseUrl = '/api',
}: ApiClientOptions = {}) {
  async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
    const { body, query, signal, authenticated = true } = options;
    const headers: Record<string, string> = { Accept: 'application/json' };
    const token = authenticated ? sessionStore.token() : null;
    if (token) headers.Authorization = `Bearer ${token}`;
    if (body !== undefined) headers['Content-Type'] = 'application/json';

    // Looked up at call time so that tests can replace the global fetch.
    const doFetch = fetchImpl ?? globalThis.fetch;
    let response: Response;
    try {
      response = await doFetch(baseUrl + path + toQueryString(query), {
        method,
        headers,
        body: body === undefined ? undefined : JSON.stringify(body),
        signal,
      });
    } catch (error) {
      if (error instanceof DOMException && error.name === 'AbortError') throw error;
      throw new ApiUnreachableError(error);
    }

    const payload = await readJson(response);
    // A 503 "cannot reach its database" is an outage, not a verdict on the session: it is
    // shown as such and never ends the session. Any other answer means the database is back.
    const databaseDown = response.status === 503 && isApiError(payload) && payload.message === DATABASE_UNAVAILABLE_MESSAGE;
    if (databaseDown) serverStatus.databaseDown();
    else serverStatus.reachable();
    if (response.ok) return payload as T;

    // A 401 on a request that carried a token means the server no longer accepts it (expired,
    // revoked, user deactivated): the session is over, whatever the local clock says. Only if
    // that token is still the current one: a newer session must not end over an old request.
    if (response.status === 401 && token && sessionStore.getSnapshot().session?.token === token) {
      sessionStore.end('expired');
    }
    throw new ApiRequestError(
      response.status,
      isApiError(payload) ? payload : null,
      `The server answered ${response.status} ${response.statusText}`.trim(),
    );
  }

  return {
    request,
    get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('GET', path, options),
    post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
    patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
    delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;

function toQueryString(query: Record<string, QueryValue> | undefined): string {
  if (!query) return '';
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    // Empty filters are left out rather than sent as "action=".
    if (value === undefined || value === null || value === '') continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

async function readJson(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined;
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

/** The client the application uses. */
export const api = createApiClient();
