import { ApiRequestError, ApiUnreachableError, isApiError } from './api-error';
import { sessionStore as defaultSessionStore, type SessionStore } from './session-store';

/**
 * File transfers the JSON client does not do: a multipart upload answering JSON, and a download
 * handed to the browser as a file. Both carry the session's bearer token.
 */
export interface FileTransferOptions {
  sessionStore?: SessionStore;
  baseUrl?: string;
}

async function send(path: string, init: RequestInit, { sessionStore = defaultSessionStore, baseUrl = '/api' }: FileTransferOptions): Promise<Response> {
  const token = sessionStore.token();
  const headers: Record<string, string> = {};
  if (token) headers.Authorization = `Bearer ${token}`;
  let response: Response;
  try {
    response = await globalThis.fetch(baseUrl + path, { ...init, headers: { ...headers, ...(init.headers as Record<string, string> | undefined) } });
  } catch (error) {
    throw new ApiUnreachableError(error);
  }
  if (response.ok) return response;
  if (response.status === 401 && token) sessionStore.end('expired');
  const text = await response.text();
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  throw new ApiRequestError(response.status, isApiError(body) ? body : null, `The server answered ${response.status} ${response.statusText}`.trim());
}

/** POST a file as multipart field `file`; answers the JSON reply. */
export async function uploadFile<T>(path: string, file: File, options: FileTransferOptions = {}): Promise<T> {
  const form = new FormData();
  form.append('file', file, file.name);
  const response = await send(path, { method: 'POST', body: form, headers: { Accept: 'application/json' } }, options);
  return (await response.json()) as T;
}

/** GET a file and hand it to the browser's downloads under `fileName`. */
export async function downloadFile(path: string, fileName: string, options: FileTransferOptions = {}): Promise<void> {
  const response = await send(path, { method: 'GET' }, options);
  const blob = await response.blob();
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.appendChild(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
