import { API_PREFIX, API_ROUTES, type TokenResponse } from '@rotaplex/contracts';
import { ApiRequestError, toApiError } from './errors';
import { session } from './session';

export type QueryValue = string | number | boolean | undefined | null;

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  query?: Record<string, QueryValue>;
  /** Send the access token and refresh it once on a 401 (default true). */
  auth?: boolean;
  signal?: AbortSignal;
}

let origin = '';

/** Points the client at another origin (tests); the web app uses its own origin (''). */
export function setApiOrigin(value: string): void {
  origin = value.replace(/\/+$/, '');
}

/** Builds "/api/users?page=2&q=ann" from a route and query values; empty values are left out. */
export function buildUrl(path: string, query?: Record<string, QueryValue>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value === undefined || value === null || value === '') continue;
    params.set(key, String(value));
  }
  const search = params.toString();
  return `${origin}${API_PREFIX}${path}${search ? `?${search}` : ''}`;
}

async function send(path: string, options: RequestOptions, withToken: boolean): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  const token = session.getAccessToken();
  if (withToken && token) headers.Authorization = `Bearer ${token}`;
  return fetch(buildUrl(path, options.query), {
    method: options.method ?? 'GET',
    headers,
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    credentials: 'include',
    signal: options.signal,
  });
}

async function readBody(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined;
  const text = await response.text();
  if (!text) return undefined;
  const type = response.headers.get('content-type') ?? '';
  if (type.includes('json')) {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      return text;
    }
  }
  return text;
}

async function parse<T>(response: Response): Promise<T> {
  const body = await readBody(response);
  if (!response.ok) throw new ApiRequestError(toApiError(response.status, response.statusText, body));
  return body as T;
}

let refreshing: Promise<boolean> | null = null;

/**
 * Exchanges the refresh cookie for a new access token. Concurrent callers share one request, so a
 * burst of 401s triggers a single refresh (the server rotates the cookie on each use).
 */
export function refreshSession(): Promise<boolean> {
  refreshing ??= (async () => {
    try {
      const response = await send(API_ROUTES.auth.refresh, { method: 'POST' }, false);
      if (!response.ok) return false;
      session.signedIn((await response.json()) as TokenResponse);
      return true;
    } catch {
      return false;
    } finally {
      refreshing = null;
    }
  })();
  return refreshing;
}

/**
 * Calls the API. With `auth` (the default) it attaches the in-memory access token; on a 401 it
 * refreshes once and retries; when the refresh fails the session ends and the app goes to sign-in.
 */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const auth = options.auth ?? true;
  const response = await send(path, options, auth);
  if (response.status === 401 && auth) {
    const hadSession = session.getState().status === 'signedIn';
    if (await refreshSession()) return parse<T>(await send(path, options, true));
    if (hadSession) session.signedOut('expired');
  }
  return parse<T>(response);
}

export const api = {
  get: <T>(path: string, query?: Record<string, QueryValue>, signal?: AbortSignal) =>
    apiRequest<T>(path, { query, signal }),
  post: <T>(path: string, body?: unknown, options: Omit<RequestOptions, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'POST', body }),
  patch: <T>(path: string, body: unknown) => apiRequest<T>(path, { method: 'PATCH', body }),
  delete: <T>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
};
