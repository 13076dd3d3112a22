/**
 * A job kind's worker-thread pool, started on the first job (a worker process that never takes
 * a job of this kind starts no threads) and destroyed when the kind closes.
 */
import type { Piscina } from 'piscina';

export function lazyPool() {
  let pool: Piscina | null = null;
  return {
    /** The pool, created by `create` the first time. */
    get: (create: () => Piscina): Piscina => (pool ??= create()),
    close: async (): Promise<void> => {
      await pool?.destroy();
      pool = null;
    },
  };
}
