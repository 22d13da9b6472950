/**
 * The one way the browser talks to /api: JSON in and out, the session cookie, and the CSRF
 * token the server ties to that session. Every failure becomes an {@link ApiError}.
 */

export interface ApiErrorBody {
  code: string;
  message: string;
  fields?: Record<string, string>;
}

/** A failed API call: HTTP status (0 when the network failed), the contract's code, message and field errors. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  /** The whole answer, for errors that carry more than the message (a save conflict's current version). */
  readonly payload: unknown;

  constructor(status: number, body: ApiErrorBody, payload?: unknown) {
    super(body.message);
    this.name = 'ApiError';
    this.status = status;
    this.code = body.code;
    this.fields = body.fields ?? {};
    this.payload = payload;
  }
}

/** True for an {@link ApiError}, optionally with one of the given statuses. */
export function isApiError(error: unknown, ...statuses: number[]): error is ApiError {
  return error instanceof ApiError && (statuses.length === 0 || statuses.includes(error.status));
}

/** Reads the contract's `{ error: { code, message, fields? } }`, falling back to a plain message for anything else (a proxy's HTML page, an empty body). */
export function toApiError(status: number, payload: unknown): ApiError {
  const error = isRecord(payload) ? payload.error : undefined;
  if (isRecord(error) && typeof error.code === 'string' && typeof error.message === 'string') {
    const fields = isRecord(error.fields) ? stringEntries(error.fields) : undefined;
    return new ApiError(status, { code: error.code, message: error.message, fields }, payload);
  }
  return new ApiError(status, { code: `http_${status}`, message: fallbackMessage(status) });
}

function fallbackMessage(status: number): string {
  if (status >= 500) return 'The server could not answer just now. Please try again in a moment.';
  if (status === 404) return 'That could not be found.';
  return `The request failed (HTTP ${status}).`;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function stringEntries(record: Record<string, unknown>): Record<string, string> {
  return Object.fromEntries(Object.entries(record).filter((e): e is [string, string] => typeof e[1] === 'string'));
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type QueryValue = string | number | boolean | null | undefined;

export interface RequestOptions {
  body?: unknown;
  /** Added to the path as search params; null and undefined values are left out. */
  query?: Record<string, QueryValue>;
  signal?: AbortSignal;
  /** Lets the request finish after the page has gone (a save as the weaver leaves); bodies must stay under 64 KiB. */
  keepalive?: boolean;
}

// Kept in memory only: a token in storage would outlive the session it belongs to.
let csrfToken: string | null = null;
let pendingToken: Promise<string> | null = null;

/** Forgets the CSRF token, so the next write fetches a fresh one. */
export function resetCsrfToken(): void {
  csrfToken = null;
  pendingToken = null;
}

async function loadCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  // Several writes at once share one GET /api/csrf.
  pendingToken ??= send<{ token: string }>('GET', '/api/csrf', {}, null)
    .then(({ token }) => {
      csrfToken = token;
      return token;
    })
    .finally(() => {
      pendingToken = null;
    });
  return pendingToken;
}

/**
 * Fetches the CSRF token now, so a later write needs no request before its own. A save sent as the
 * weaver leaves (keepalive) must start at once: an ordinary token request first would be cut off by
 * the next page load, and the save never sent.
 */
export async function prepareWrites(): Promise<void> {
  await loadCsrfToken();
}

/** Builds `/api/x?a=1` from a path and a query object, in the object's key order. */
export function withQuery(path: string, query: Record<string, QueryValue> = {}): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== null && value !== undefined && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return search ? `${path}?${search}` : path;
}

async function send<T>(method: Method, path: string, options: RequestOptions, token: string | null): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  // A FormData body (a file upload) sets its own multipart content type.
  const isForm = options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  if (token) headers['x-csrf-token'] = token;

  let response: Response;
  try {
    response = await fetch(withQuery(path, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
      keepalive: options.keepalive,
    });
  } catch (cause) {
    if (options.signal?.aborted) throw cause;
    throw new ApiError(0, { code: 'network', message: 'Could not reach Shedwright. Check your connection and try again.' });
  }

  const text = await response.text();
  let payload: unknown = undefined;
  if (text) {
    try {
      payload = JSON.parse(text);
    } catch {
      payload = undefined;
    }
  }
  if (!response.ok) throw toApiError(response.status, payload);
  // Sign-in, sign-up, sign-out and reset regenerate the session and hand back its new token.
  if (isRecord(payload) && typeof payload.csrfToken === 'string') csrfToken = payload.csrfToken;
  return payload as T;
}

/** Sends one request; writes carry the CSRF token and are retried once with a fresh token when the server rejects it. */
export async function apiRequest<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  if (method === 'GET') return send<T>(method, path, options, null);
  const token = await loadCsrfToken();
  try {
    return await send<T>(method, path, options, token);
  } catch (error) {
    // The session behind the token may have changed (expired, signed in elsewhere): one retry with a new token.
    if (!(error instanceof ApiError && error.status === 403 && error.code === 'csrf')) throw error;
    if (csrfToken === token) csrfToken = null;
    return send<T>(method, path, options, await loadCsrfToken());
  }
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => apiRequest<T>('GET', path, options),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, { body }),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>('PATCH', path, { body }),
  put: <T>(path: string, body?: unknown, options?: Pick<RequestOptions, 'keepalive'>) => apiRequest<T>('PUT', path, { ...options, body }),
  /** Sends a multipart form (file uploads). */
  postForm: <T>(path: string, form: FormData) => apiRequest<T>('POST', path, { body: form }),
  delete: <T>(path: string) => apiRequest<T>('DELETE', path),
};

/** The per-field messages of a failed call, or none. */
export function fieldErrorsOf(error: unknown): Record<string, string> {
  return error instanceof ApiError ? error.fields : {};
}
