/** The server's error body: a sentence for people and, for form input, one message per field. */
export interface ErrorBody {
  error: string;
  fields?: Record<string, string>;
}

export class ApiError extends Error {
  readonly status: number;
  readonly fields?: Record<string, string>;
  /** Set when the 401 already sent the person back to sign-in, so nobody reports it twice. */
  sessionExpired = false;

  constructor(status: number, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.fields = fields && Object.keys(fields).length > 0 ? fields : undefined;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}
