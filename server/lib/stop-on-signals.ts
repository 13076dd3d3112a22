/**
 * Ends a process cleanly on SIGINT or SIGTERM: logs the signal, runs the steps in order (stop
 * taking work, finish or hand back jobs, close mail and the database pool), then exits 0. A
 * second signal while stopping is ignored, so steps never run twice. Shared by the web process
 * (main.ts) and the worker process (worker.ts).
 */
import type { Logger } from './logger';

type Step = () => unknown;

/** The shutdown sequence itself (tests call it without sending signals). */
export function createShutdown(
  logger: Pick<Logger, 'info'>,
  message: string,
  steps: readonly Step[],
  exit: (code: number) => void = (code) => process.exit(code),
): (signal: NodeJS.Signals) => Promise<void> {
  let stopping = false;
  return async (signal) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, message);
    for (const step of steps) await step();
    exit(0);
  };
}

export function stopOnSignals(logger: Logger, message: string, steps: readonly Step[]): void {
  const shutdown = createShutdown(logger, message, steps);
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}
