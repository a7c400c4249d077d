import type { ApiError as ApiErrorBody } from '@busbar/shared';

/** A failed request, carrying the server's code, message and per-field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** Query values; a list repeats its key (`status=a&status=b`). */
type Query = Record<string, string | number | boolean | readonly string[] | undefined | null>;

interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  query?: Query;
}

const CSRF_COOKIE = 'busbar.csrf';
const NETWORK_MESSAGE = 'Busbar could not reach the server. Check the connection and try again.';

let onUnauthenticated: ((path: string) => void) | null = null;

/** Called when a request answers 401, i.e. the session ended while the app was open. */
export function setUnauthenticatedHandler(handler: (path: string) => void): void {
  onUnauthenticated = handler;
}

/** The forgery-protection token to send back as a header (also for uploads, which skip `request`). */
export function csrfToken(): string | undefined {
  const prefix = `${CSRF_COOKIE}=`;
  const cookie = document.cookie.split('; ').find((part) => part.startsWith(prefix));
  return cookie ? decodeURIComponent(cookie.slice(prefix.length)) : undefined;
}

function urlOf(path: string, query: Query = {}): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (Array.isArray(value)) for (const item of value) params.append(key, item);
    else if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return `/api${path}${search ? `?${search}` : ''}`;
}

async function errorFrom(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => null)) as Partial<ApiErrorBody> | null;
  if (body?.error?.message) {
    return new ApiError(response.status, body.error.code, body.error.message, body.error.fields);
  }
  return new ApiError(
    response.status,
    'internal',
    `The server answered with an error (${response.status}). Try again in a moment.`,
  );
}

/** Sends one JSON request to the Busbar API and returns the parsed answer (undefined for 204). */
export function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
  return send<T>(path, options, true);
}

async function send<T>(path: string, options: RequestOptions, mayRetry: boolean): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') {
    const token = csrfToken();
    if (token) headers['X-CSRF-Token'] = token;
  }

  let response: Response;
  try {
    response = await fetch(urlOf(path, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
    });
  } catch {
    throw new ApiError(0, 'network', NETWORK_MESSAGE);
  }

  if (!response.ok) {
    const error = await errorFrom(response);
    // The token follows the session, which another tab's sign-in or sign-out or an expiry may have changed; the refusal set a fresh one.
    if (error.code === 'csrf' && mayRetry) return send<T>(path, options, false);
    if (error.status === 401) onUnauthenticated?.(path);
    throw error;
  }
  if (response.status === 204) return undefined as T;
  return (await response.json()) as T;
}

/** The message to show for any thrown value. */
export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong in Busbar. Reload the page and try again.';
}

/** True for the answer to a change made against an old version of a record (someone saved first). */
export function isStale(error: unknown): error is ApiError {
  return error instanceof ApiError && error.status === 409 && error.code === 'stale';
}
