/**
 * Work done after the answer has gone out, so that how long a request takes says nothing about
 * the work (e.g. whether an e-mail address has an account). Failures are logged; tests and a
 * graceful shutdown can wait for everything pending with settleAfterResponse().
 */
import type { Logger } from './logger';

const pending = new Set<Promise<void>>();

export function runAfterResponse(logger: Logger, label: string, work: () => Promise<void>): void {
  const p: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
    .then(work)
    .catch((err: unknown) => logger.error({ err }, `${label} failed`))
    .finally(() => pending.delete(p));
  pending.add(p);
}

export async function settleAfterResponse(): Promise<void> {
  while (pending.size > 0) await Promise.all([...pending]);
}
