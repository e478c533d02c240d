import type { CsrfResponse } from '../shared/auth';
import { isApiErrorBody, type ErrorCode } from '../shared/errors';

// The one place the client talks HTTP. It owns JSON, the CSRF token, the error
// shape and what happens when the session is gone.
//
// CSRF: the server uses a double-submit token. We fetch it lazily with
// GET /api/auth/csrf before the first state-changing request and send it as
// `x-csrf-token`. Signing in changes the session (and so the token): the login
// response carries the new one, which callers hand to `setCsrfToken`. A 403
// `csrf_invalid` means our token went stale; we fetch a new one and retry once.

export class ApiError extends Error {
  readonly status: number;
  readonly code: ErrorCode;
  readonly details: unknown;

  constructor(status: number, code: ErrorCode, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const UNSAFE: ReadonlySet<Method> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

let csrfToken: string | null = null;
let csrfRequest: Promise<string> | null = null;
let onUnauthenticated: () => void = () => {
  const next = window.location.pathname + window.location.search;
  window.location.assign(`/sign-in?next=${encodeURIComponent(next)}`);
};

export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

/** The app installs a router-aware handler; the default is a full page load. */
export function setUnauthenticatedHandler(handler: () => void): void {
  onUnauthenticated = handler;
}

async function freshCsrfToken(): Promise<string> {
  csrfRequest ??= send<CsrfResponse>('GET', '/api/auth/csrf', undefined, null)
    .then((body) => (csrfToken = body.token))
    .finally(() => (csrfRequest = null));
  return csrfRequest;
}

async function send<T>(method: Method, path: string, body: unknown, token: string | null): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  // FormData (file uploads) sets its own multipart content type.
  const form = body instanceof FormData;
  if (body !== undefined && !form) headers['content-type'] = 'application/json';
  if (token) headers['x-csrf-token'] = token;

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : form ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network_error', 'The server could not be reached. Check your connection and try again.');
  }

  if (response.status === 204 || response.status === 202) {
    return undefined as T;
  }
  const text = await response.text();
  let parsed: unknown = undefined;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = undefined;
    }
  }
  if (response.ok) return parsed as T;

  if (isApiErrorBody(parsed)) {
    const { code, message, details } = parsed.error;
    throw new ApiError(response.status, code, message, details);
  }
  throw new ApiError(response.status, 'http_error', `The server answered ${response.status}. Please try again.`);
}

async function request<T>(method: Method, path: string, body?: unknown): Promise<T> {
  const unsafe = UNSAFE.has(method);
  try {
    const token = unsafe ? (csrfToken ?? (await freshCsrfToken())) : null;
    try {
      return await send<T>(method, path, body, token);
    } catch (error) {
      const stale = error instanceof ApiError && error.status === 403 && error.code === 'csrf_invalid';
      if (!unsafe || !stale) throw error;
      return await send<T>(method, path, body, await freshCsrfToken());
    }
  } catch (error) {
    // A wrong password is also a 401, but it is an answer, not a lost session.
    if (error instanceof ApiError && error.status === 401 && error.code === 'unauthenticated') onUnauthenticated();
    throw error;
  }
}

/** The CSRF token for a request made outside this module (an upload with progress over XMLHttpRequest). */
export async function csrfTokenForUpload(): Promise<string> {
  return csrfToken ?? (await freshCsrfToken());
}

/** An API error from a status and a response body text, as `send` makes them. */
export function apiErrorFrom(status: number, text: string): ApiError {
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    parsed = undefined;
  }
  if (isApiErrorBody(parsed)) return new ApiError(status, parsed.error.code, parsed.error.message, parsed.error.details);
  return new ApiError(status, 'http_error', `The server answered ${status}. Please try again.`);
}

export const api = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, body),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  postForm: <T>(path: string, form: FormData) => request<T>('POST', path, form),
  delete: <T = void>(path: string) => request<T>('DELETE', path),
};
