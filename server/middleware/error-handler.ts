import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from '../lib/errors';
import { DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '../lib/db-errors';

export const notFoundHandler: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: 'No such API route.' } });
};

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof ZodError) {
    const fields = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    res.status(400).json({
      error: { code: 'invalid_input', message: fields[0]?.message ?? 'Invalid input.', fields },
    });
    return;
  }
  if (err instanceof AppError) {
    res
      .status(err.status)
      .json({ error: { code: err.code, message: err.message, fields: err.fields } });
    return;
  }
  // express.json() and multer signal malformed bodies with a status of their own.
  const status =
    (err as { status?: number; statusCode?: number }).status ??
    (err as { statusCode?: number }).statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const type = (err as { type?: string }).type;
    res.status(status).json({
      error: {
        code:
          type === 'entity.parse.failed'
            ? 'malformed_json'
            : type === 'entity.too.large'
              ? 'too_large'
              : 'bad_request',
        message:
          type === 'entity.parse.failed'
            ? 'The request body is not valid JSON.'
            : type === 'entity.too.large'
              ? tooLargeMessage(err as { limit?: number })
              : String((err as Error).message),
      },
    });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    // Nothing was stored (or the write was idempotent): the client may simply try again.
    req.log?.warn({ code: rootCode(err) }, 'database unavailable');
    res.set('Retry-After', String(DATABASE_RETRY_AFTER_SECONDS));
    res.status(503).json({
      error: {
        code: 'service_unavailable',
        message: 'The service is briefly unavailable. Please try again in a moment.',
      },
    });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res
    .status(500)
    .json({ error: { code: 'internal', message: 'Something went wrong on our side.' } });
};

function rootCode(err: unknown): string | undefined {
  let e = err as { code?: string; cause?: unknown } | undefined;
  while (e?.cause) e = e.cause as typeof e;
  return e?.code;
}

function tooLargeMessage(err: { limit?: number }): string {
  const kB = typeof err.limit === 'number' ? ` (at most ${Math.floor(err.limit / 1024)} kB)` : '';
  return `The request body is too large${kB}.`;
}
