import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { SaveConflict } from '../../shared/schemas/save-version.js';

/** An error whose message is safe to show; anything else becomes a generic 500. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}
export class BadRequestError extends HttpError {
  constructor(message: string, fields?: Record<string, string>) { super(400, message, fields); }
}
export class UnauthorisedError extends HttpError {
  constructor(message = 'sign in first') { super(401, message); }
}
export class ForbiddenError extends HttpError {
  constructor(message = 'your role may not do this') { super(403, message); }
}
export class NotFoundError extends HttpError {
  constructor(message = 'not found') { super(404, message); }
}
export class ConflictError extends HttpError {
  constructor(message: string, fields?: Record<string, string>) { super(409, message, fields); }
}
/** A save based on an older version than the one stored: 409 with who saved the newer one and when. */
export class StaleSaveError extends ConflictError {
  constructor(message: string, readonly conflict: SaveConflict) { super(message); }
}
export class GoneError extends HttpError {
  constructor(message: string) { super(410, message); }
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`no API route ${req.method} ${req.path}`));
};

/** SQLite's "database is locked" after the busy timeout, however TypeORM wraps it. */
function isBusy(err: unknown): boolean {
  const e = err as { code?: string; driverError?: { code?: string } } | null;
  return e?.code === 'SQLITE_BUSY' || e?.driverError?.code === 'SQLITE_BUSY' || e?.code === 'SQLITE_BUSY_SNAPSHOT';
}

/** The one place errors become responses: `{ error, fields? }`, never a stack or SQL. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof HttpError) {
    const conflict = err instanceof StaleSaveError ? { conflict: err.conflict } : {};
    res.status(err.status).json(err.fields ? { error: err.message, fields: err.fields, ...conflict } : { error: err.message, ...conflict });
    return;
  }
  if (isBusy(err)) {
    console.error(`[busy] ${req.method} ${req.originalUrl}: database locked past the busy timeout`);
    res.status(503).set('Retry-After', '1').json({ error: 'the database is busy; nothing was changed, try again in a moment' });
    return;
  }
  // body-parser and multer mark their own errors with a status (413 too large, 400 bad JSON).
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status === 500) {
    console.error(`[error] ${req.method} ${req.originalUrl}`, err);
    res.status(500).json({ error: 'internal error; the server log has the details' });
    return;
  }
  const message =
    err.type === 'entity.too.large' ? 'request body is too large' :
    err.type === 'entity.parse.failed' ? 'request body is not valid JSON' :
    'bad request';
  res.status(status).json({ error: message });
};
