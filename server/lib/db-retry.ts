/**
 * Retries a database write while PostgreSQL is unreachable (a restart, a failover), for
 * background work whose result must not be thrown away by a short outage: a finished
 * estimation, a sent mail's receipt. Request handlers do not use this; they answer 503 and
 * let the client retry.
 */
import { isDatabaseUnavailable } from './db-errors';

export async function retryWhileDatabaseUnavailable<T>(
  write: () => Promise<T>,
  opts: { timeoutMs?: number; delayMs?: number; onRetry?: (err: unknown) => void } = {},
): Promise<T> {
  const deadline = Date.now() + (opts.timeoutMs ?? 120_000);
  let delay = opts.delayMs ?? 250;
  for (;;) {
    try {
      return await write();
    } catch (err) {
      if (!isDatabaseUnavailable(err) || Date.now() + delay > deadline) throw err;
      opts.onRetry?.(err);
      await new Promise((r) => setTimeout(r, delay));
      delay = Math.min(delay * 2, 5_000);
    }
  }
}
