import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { app: 'choicewright' },
    redact: ['req.headers.cookie', 'req.headers.authorization'],
  });
}
export type { Logger };
