import multer from 'multer';
import type { RequestHandler } from 'express';
import { BadRequestError, HttpError } from './errors.js';

export const MAX_UPLOAD_BYTES = 1024 * 1024;

const single = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 20 } }).single('file');

/** One CSV file in the multipart field `file`, kept in memory (≤ 1 MiB); multer's errors become clear 4xx. */
export const csvUpload: RequestHandler = (req, res, next) => {
  single(req, res, (err: unknown) => {
    if (!err) {
      if (!req.file) return next(new BadRequestError('no file: send the CSV in the multipart field "file"', { file: 'is required' }));
      return next();
    }
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `file is larger than ${MAX_UPLOAD_BYTES / 1024} KiB`));
      return next(new BadRequestError(`upload refused: ${err.message}`, { file: err.message }));
    }
    // Anything else multer passes on comes from reading the multipart body: a request cut off before its
    // closing boundary, a missing boundary or a malformed part header. The sender can fix all of them.
    const reason = err instanceof Error ? err.message : String(err);
    next(new BadRequestError(`upload is incomplete or malformed (${reason}); send the whole file again`, { file: reason }));
  });
};
