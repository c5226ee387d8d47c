import type { CsrfResponse } from '@shared/schemas/auth';
import type { ErrorResponse } from '@shared/schemas/errors';

/** One fetch wrapper for the API: JSON in and out, the CSRF header, and typed errors. */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;

async function getCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  if (!res.ok) throw new ApiError(res.status, 'csrf', 'Could not start a secure session; reload the page');
  csrfToken = ((await res.json()) as CsrfResponse).token;
  return csrfToken;
}

/** Forget the CSRF token (it changes when the session does: sign-in, sign-out). */
export function resetCsrfToken() {
  csrfToken = null;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

async function toError(res: Response): Promise<ApiError> {
  try {
    // Read with care: a proxy in between may answer with a body of its own.
    const body = (await res.json()) as { error?: Partial<ErrorResponse['error']> };
    const e = body.error ?? {};
    return new ApiError(res.status, e.code ?? 'error', e.message ?? res.statusText, e.fields);
  } catch {
    return new ApiError(res.status, 'error', res.statusText || 'The server did not answer as expected');
  }
}

export async function apiRequest<T>(method: Method, path: string, body?: unknown, init: RequestInit = {}): Promise<T> {
  const headers = new Headers(init.headers);
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  if (body !== undefined && !isForm) headers.set('Content-Type', 'application/json');
  if (method !== 'GET') headers.set('X-CSRF-Token', await getCsrfToken());
  let res: Response;
  try {
    res = await fetch(path, {
      ...init,
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'offline', 'The server could not be reached; check the connection and try again');
  }
  if (res.status === 403 && method !== 'GET') {
    const err = await toError(res);
    if (err.code === 'csrf') {
      resetCsrfToken();
      return apiRequest<T>(method, path, body, init);
    }
    throw err;
  }
  if (!res.ok) throw await toError(res);
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  return (type.includes('application/json') ? await res.json() : await res.arrayBuffer()) as T;
}

export const api = {
  get: <T>(path: string) => apiRequest<T>('GET', path),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, body ?? {}),
  put: <T>(path: string, body?: unknown) => apiRequest<T>('PUT', path, body ?? {}),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>('PATCH', path, body ?? {}),
  delete: <T>(path: string) => apiRequest<T>('DELETE', path),
};
