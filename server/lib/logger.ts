/**
 * The process logger. Secrets never reach it: request logs carry route patterns and no headers
 * (server/lib/request-log.ts), and the paths below are censored wherever else they appear.
 */
import { pino, type Logger, type DestinationStream } from 'pino';
import { serializeError } from './log-error';

/** Anything named like a credential is censored wherever a log call puts it. */
export const REDACTED_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-respondent-token"]',
  'res.headers["set-cookie"]',
  '*.password',
  '*.newPassword',
  '*.currentPassword',
  '*.token',
  '*.sessionToken',
  '*.tokenHash',
];

export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = {
    level,
    base: { app: 'choicewright' },
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
    serializers: { err: serializeError },
  };
  return destination ? pino(options, destination) : pino(options);
}
export type { Logger };
