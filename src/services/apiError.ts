import type { SaveConflict } from '@shared/schemas/save-version';

export type { SaveConflict } from '@shared/schemas/save-version';

/** The server's error body: a sentence for people and, for form input, one message per field. */
export interface ErrorBody {
  error: string;
  fields?: Record<string, string>;
  /** On a 409 for a stale save: the version that stands, who saved it and when. */
  conflict?: SaveConflict;
}

export class ApiError extends Error {
  readonly status: number;
  readonly fields?: Record<string, string>;
  /** Set when the 401 already sent the person back to sign-in, so nobody reports it twice. */
  sessionExpired = false;
  /** Set when a save was refused because someone else saved a newer version first. */
  conflict?: SaveConflict;

  constructor(status: number, message: string, fields?: Record<string, string>, conflict?: SaveConflict) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.fields = fields && Object.keys(fields).length > 0 ? fields : undefined;
    this.conflict = conflict;
  }
}

/** The conflict of a save refused as stale, or null for any other outcome. */
export function saveConflictOf(error: unknown): SaveConflict | null {
  return error instanceof ApiError && error.status === 409 && error.conflict ? error.conflict : null;
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}
