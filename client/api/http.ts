// The only code that knows how to talk to the server: JSON in and out, errors as ApiError.

export type ApiErrorBody = {
  error?: {
    code?: string;
    message?: string;
    fields?: Record<string, string>;
    [extra: string]: unknown;
  };
};

/**
 * An error answer from the API, with its stable code, per-field messages and any other
 * values the server put in the error (e.g. `current` on a 409 JOURNAL_CHANGED).
 */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields: Record<string, string> = {},
    public readonly details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type RequestOptions = {
  query?: Record<string, unknown>;
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
};

let csrfToken: string | null = null;

async function fetchCsrfToken(): Promise<string> {
  const response = await fetch('/api/auth/csrf', {
    credentials: 'same-origin',
    headers: { accept: 'application/json' },
  });
  if (!response.ok)
    throw new ApiError(
      response.status,
      'CSRF_UNAVAILABLE',
      'Could not start a secure session. Reload the page.',
    );
  const data = (await response.json()) as { token: string };
  csrfToken = data.token;
  return csrfToken;
}

/** The session's CSRF token, fetched once; for requests sent outside `http` (upload progress). */
export async function getCsrfToken(): Promise<string> {
  return csrfToken ?? (await fetchCsrfToken());
}

/** Forgets the CSRF token, e.g. after sign-in or sign-out when the session changes. */
export function resetCsrfToken(): void {
  csrfToken = null;
}

function buildUrl(path: string, query?: Record<string, unknown>): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    if (Array.isArray(value)) value.forEach((item) => params.append(key, String(item)));
    else params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

async function send<T>(
  method: Method,
  path: string,
  options: RequestOptions,
  retried = false,
): Promise<T> {
  const headers: Record<string, string> = { ...options.headers, accept: 'application/json' };
  let body: BodyInit | undefined;
  if (options.body instanceof FormData) body = options.body;
  else if (options.body !== undefined) {
    headers['content-type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken ?? (await fetchCsrfToken());
  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      body,
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (error) {
    if ((error as Error).name === 'AbortError') throw error;
    throw new ApiError(
      0,
      'NETWORK',
      'The server could not be reached. Check your connection and try again.',
    );
  }
  if (response.status === 204) return undefined as T;
  const isJson = response.headers.get('content-type')?.includes('application/json');
  const data = isJson ? await response.json() : null;
  if (!response.ok) {
    const err = (data as ApiErrorBody | null)?.error;
    if (err?.code === 'CSRF_INVALID' && !retried) {
      csrfToken = null;
      return send<T>(method, path, options, true);
    }
    const { code, message, fields, ...details } = err ?? {};
    throw new ApiError(
      response.status,
      code ?? 'HTTP_ERROR',
      message ?? `The server answered ${response.status}.`,
      fields,
      details,
    );
  }
  return data as T;
}

export const http = {
  get: <T>(path: string, query?: Record<string, unknown>, signal?: AbortSignal) =>
    send<T>('GET', path, { query, signal }),
  post: <T>(path: string, body?: unknown) => send<T>('POST', path, { body }),
  put: <T>(path: string, body?: unknown, headers?: Record<string, string>) =>
    send<T>('PUT', path, { body, headers }),
  patch: <T>(path: string, body?: unknown) => send<T>('PATCH', path, { body }),
  delete: <T>(path: string, body?: unknown) => send<T>('DELETE', path, { body }),
};
