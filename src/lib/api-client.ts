import type { ErrorBody } from '../../shared/schemas/auth';

/** An API failure with the server's own message and per-field issues. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: { path: string; message: string }[] = [],
  ) {
    super(message);
  }
}

type Listener = () => void;
const unauthenticatedListeners = new Set<Listener>();

/** Called when any request answers 401 (the session ended); the app then shows sign-in. */
export function onUnauthenticated(listener: Listener): () => void {
  unauthenticatedListeners.add(listener);
  return () => unauthenticatedListeners.delete(listener);
}

let csrfToken: Promise<string> | null = null;
/** The session's CSRF token, fetched once; for requests that cannot go through `api` (upload progress). */
export function getCsrfToken(): Promise<string> {
  csrfToken ??= fetch('/api/auth/csrf', { credentials: 'same-origin' })
    .then((r) => r.json() as Promise<{ csrfToken: string }>)
    .then((b) => b.csrfToken)
    .catch((err) => {
      csrfToken = null;
      throw err;
    });
  return csrfToken;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** 401 is an expected answer here (e.g. the sign-in form); do not broadcast it. */
  quiet401?: boolean;
}

async function toError(res: Response): Promise<ApiError> {
  let body: Partial<ErrorBody> = {};
  try {
    body = (await res.json()) as ErrorBody;
  } catch {
    /* not JSON: keep the status text */
  }
  return new ApiError(res.status, body.error ?? `${res.status} ${res.statusText || 'request failed'}`, body.issues ?? []);
}

/** fetch for our JSON API: sends the CSRF header, parses JSON, turns failures into ApiError. */
export async function api<T>(path: string, options: RequestOptions = {}, retried = false): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  let body: BodyInit | undefined;
  if (options.body instanceof FormData) body = options.body;
  else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  if (method !== 'GET') headers['x-csrf-token'] = await getCsrfToken();

  let res: Response;
  try {
    res = await fetch(path, { method, headers, body, credentials: 'same-origin', signal: options.signal });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(0, 'Cannot reach the Falsetrace server. Check your connection and try again.');
  }
  if (res.status === 403 && method !== 'GET' && !retried) {
    const err = await toError(res.clone());
    if (/csrf/i.test(err.message)) {
      csrfToken = null;
      return api<T>(path, options, true);
    }
  }
  if (!res.ok) {
    if (res.status === 401 && !options.quiet401) unauthenticatedListeners.forEach((l) => l());
    throw await toError(res);
  }
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

/** After sign-in/out the cookie jar changed; fetch a fresh token next time. */
export const resetCsrfToken = () => {
  csrfToken = null;
};
