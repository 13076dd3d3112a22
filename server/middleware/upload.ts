/**
 * Multipart uploads: one small file kept in memory, or large files streamed to disk, with
 * multer's own errors and the multipart parser's errors turned into the API's error model:
 * too large → 413, anything else (a malformed body included) → 400.
 */
import type { RequestHandler } from 'express';
import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
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
    upload(req, res, (err: unknown) => next(err ? toUploadError(err, field, maxBytes) : undefined));
  };
}

/**
 * Multipart uploads of large files, streamed to temporary files on disk (never held in
 * memory): one file per named field, each at most `maxBytes`. The route deletes them with
 * `removeUploadedFiles` once it has answered.
 */
export function acceptFilesOnDisk(fields: readonly string[], maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.diskStorage({ destination: tmpdir() }),
    limits: { fileSize: maxBytes, files: fields.length, fields: 5, parts: fields.length + 5 },
  }).fields(fields.map((name) => ({ name, maxCount: 1 })));
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      const field = err instanceof multer.MulterError && err.field ? err.field : fields[0];
      void removeUploadedFiles(req).finally(() => next(toUploadError(err, field, maxBytes)));
    });
  };
}

/** The file uploaded under `field` by acceptFilesOnDisk, if any. */
export function uploadedFile(req: Express.Request, field: string): Express.Multer.File | null {
  const files = req.files as Record<string, Express.Multer.File[]> | undefined;
  return files?.[field]?.[0] ?? null;
}

/** Deletes the temporary files of acceptFilesOnDisk (missing files are fine). */
export async function removeUploadedFiles(req: Express.Request): Promise<void> {
  const files = req.files as Record<string, Express.Multer.File[]> | undefined;
  if (!files) return;
  await Promise.all(
    Object.values(files)
      .flat()
      .map((f) => rm(f.path, { force: true })),
  );
}

/** multer's errors and the multipart parser's as the API's error model. */
function toUploadError(err: unknown, field: string, maxBytes: number): AppError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE')
      return new AppError(
        413,
        'file_too_large',
        `The file is larger than ${formatBytes(maxBytes)}.`,
        [{ path: field, message: `At most ${formatBytes(maxBytes)}` }],
      );
    return new ValidationError(err.message, [{ path: field, message: err.message }]);
  }
  // The multipart parser (busboy) throws plain Errors on a malformed body ("Unexpected end
  // of form", "Malformed part header"): the client's fault, so a 400, never a 500.
  const message = 'The upload could not be read: send the file as multipart/form-data.';
  return new ValidationError(message, [{ path: field, message }], 'malformed_upload');
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
