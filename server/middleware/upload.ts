/**
 * One-file multipart uploads kept in memory (small files only), with multer's own errors
 * and the multipart parser's errors turned into the API's error model: too large → 413,
 * anything else (a malformed body included) → 400.
 */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError, ValidationError } from '../lib/errors';

export function acceptOneFile(
  field: string,
  maxBytes: number,
  limits: { fields?: number; parts?: number } = {},
): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10, ...limits },
  }).single(field);
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new AppError(
              413,
              'file_too_large',
              `The file is larger than ${formatBytes(maxBytes)}.`,
              [{ path: field, message: `At most ${formatBytes(maxBytes)}` }],
            ),
          );
        return next(new ValidationError(err.message, [{ path: field, message: err.message }]));
      }
      // The multipart parser (busboy) throws plain Errors on a malformed body ("Unexpected end
      // of form", "Malformed part header"): the client's fault, so a 400, never a 500.
      const message = 'The upload could not be read: send the file as multipart/form-data.';
      next(new ValidationError(message, [{ path: field, message }], 'malformed_upload'));
    });
  };
}

/** The uploaded file, or a 400 naming the field when none was sent. */
export function requireFile(req: Express.Request, field: string): Express.Multer.File {
  if (!req.file)
    throw new ValidationError('Choose a file to upload.', [
      { path: field, message: 'Choose a file' },
    ]);
  return req.file;
}

function formatBytes(n: number): string {
  return n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(0)} MB` : `${Math.round(n / 1024)} kB`;
}
