import { ApiError, type ErrorBody } from './apiError';

export { ApiError } from './apiError';

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

// These two answer 401 as a normal outcome ("wrong password", "nobody signed in"), not as expiry.
const AUTH_PROBES = ['/api/auth/sign-in', '/api/auth/me'];

let expiryHandler: (() => void) | null = null;
let expiryReported = false;

/** Registers what happens when the session ends under us; called once at start-up. */
export function onSessionExpired(handler: () => void): void {
  expiryHandler = handler;
}

/** Stops a 401 from reporting an ended session, for a sign-out the person asked for. */
export function silenceSessionExpiry(): void {
  expiryReported = true;
}

/** Re-arms the expiry redirect after a successful sign-in. */
export function resetSessionExpiry(): void {
  expiryReported = false;
}

async function readError(response: Response): Promise<ApiError> {
  const fallback = `The server answered ${response.status} ${response.statusText}`.trim();
  try {
    const body = (await response.json()) as Partial<ErrorBody>;
    return new ApiError(response.status, body.error || fallback, body.fields, body.conflict);
  } catch {
    return new ApiError(response.status, fallback);
  }
}

async function request<T>(method: Method, path: string, body?: unknown): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A FormData body sets its own multipart boundary; everything else travels as JSON.
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'The server could not be reached. Check your connection and try again.');
  }

  if (!response.ok) {
    const error = await readError(response);
    if (response.status === 401 && !AUTH_PROBES.includes(path)) {
      error.sessionExpired = true;
      if (!expiryReported && expiryHandler) {
        expiryReported = true;
        expiryHandler();
      }
    }
    throw error;
  }

  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const http = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, body),
  /** Multipart upload, e.g. a CSV file in the field `file`. */
  upload: <T>(path: string, form: FormData) => request<T>('POST', path, form),
  delete: <T>(path: string) => request<T>('DELETE', path),
};
