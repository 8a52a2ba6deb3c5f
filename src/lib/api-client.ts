/**
 * The one way the client talks to the API: JSON in and out, the CSRF token on every state-changing
 * request, and errors as ApiError carrying the server's code, message and fields.
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Other members of the server's error object, e.g. `runId` of a run already in progress. */
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

let csrfToken: Promise<string> | null = null;

/** The session changes at sign-in and sign-out; its token must be fetched again. */
export function forgetCsrfToken() {
  csrfToken = null;
}

function getCsrfToken(): Promise<string> {
  if (!csrfToken) {
    csrfToken = fetch('/api/auth/csrf', { credentials: 'same-origin' })
      .then((r) => r.json())
      .then((body: { token: string }) => body.token)
      .catch((err) => {
        csrfToken = null;
        throw err;
      });
  }
  return csrfToken;
}

type RequestOptions = { method?: string; body?: unknown; headers?: Record<string, string>; signal?: AbortSignal };

export async function apiRequest<T>(path: string, options: RequestOptions = {}, retried = false): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && method !== 'HEAD') headers['X-CSRF-Token'] = await getCsrfToken();

  const response = await fetch(path, {
    method,
    headers,
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    credentials: 'same-origin',
    signal: options.signal,
  });

  if (response.status === 204) return undefined as T;
  const payload = await response.json().catch(() => null);
  if (!response.ok) {
    const error = payload?.error ?? {};
    // A token from before a sign-in or a server restart: fetch a fresh one and try once more.
    if (response.status === 403 && error.code === 'csrf' && !retried) {
      forgetCsrfToken();
      return apiRequest<T>(path, options, true);
    }
    const { code, message, fields, ...extra } = error;
    throw new ApiError(response.status, code ?? 'http_error', message ?? `Request failed (${response.status}).`, fields, extra);
  }
  return payload as T;
}
