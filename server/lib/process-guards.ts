/**
 * Last-resort handlers of a server process. Known faults (a lost database connection, a
 * failed progress write) are handled where they happen; anything else reaching here is a
 * bug, so the process logs it and exits, and the supervisor (`npm start`, or systemd, a
 * container runtime …) starts a fresh one. Answers are never lost this way: the respondent
 * app keeps every answer until the server has acknowledged it.
 *
 * One exception: a promise rejected because the database is unreachable. Libraries fire
 * some writes without awaiting them (pg-boss 10 marks a finished job complete that way), so a
 * PostgreSQL restart at the wrong moment surfaces here; the job then expires and is handled
 * by the queue's own expiry and our sweeps, and the process must keep running.
 */
import type { Logger } from './logger';
import { isDatabaseUnavailable } from './db-errors';

export function installProcessGuards(logger: Logger, name: string): void {
  const die = (kind: string) => (err: unknown) => {
    logger.fatal({ err }, `${name}: ${kind}; exiting so that the supervisor restarts it`);
    // Give pino a moment to write the line.
    setTimeout(() => process.exit(1), 100).unref();
  };
  process.on('uncaughtException', die('uncaught exception'));
  const fatalRejection = die('unhandled promise rejection');
  process.on('unhandledRejection', (err) => {
    if (isDatabaseUnavailable(err))
      logger.warn(
        { message: (err as Error)?.message },
        `${name}: database unreachable in a background write`,
      );
    else fatalRejection(err);
  });
}
