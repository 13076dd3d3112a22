/**
 * Runs design jobs on piscina worker threads. The worker file is TypeScript; threads start from
 * its prebuilt bundle, or through the tsx loader (ts-worker-pool.ts), so it works whether the
 * parent runs under tsx, vitest or plain node (checked by tests/engine/design/design-worker.test.ts).
 *
 *   const pool = createDesignPool({ maxThreads: 1 });
 *   const out = await runDesignInWorker(pool, { definition, spec }, { onProgress, signal });
 *   await pool.destroy();
 */
import { fileURLToPath } from 'node:url';
import { MessageChannel } from 'node:worker_threads';
import type { Piscina } from 'piscina';
import { createTsPiscina } from '../parallel/ts-worker-pool';
import type { DesignProgress } from './generate-design';
import type { DesignProgressMessage, DesignWorkerResult } from './design-worker-messages';

const WORKER_FILE = fileURLToPath(new URL('./design-worker.ts', import.meta.url));

/**
 * A pool of design worker threads (default 1: design jobs are CPU-bound and sequential). A
 * thread ends as soon as it is idle unless `idleTimeoutMs` keeps it for the next job (tests that
 * run several jobs in a row).
 */
export function createDesignPool(
  options: { maxThreads?: number; nice?: number; idleTimeoutMs?: number } = {},
): Piscina {
  return createTsPiscina({
    filename: WORKER_FILE,
    minThreads: 0,
    maxThreads: options.maxThreads ?? 1,
    idleTimeout: options.idleTimeoutMs ?? 0,
    // Thread priority (server/engine/parallel/thread-priority.ts).
    workerData: { nice: options.nice },
  });
}

/**
 * Runs one job; progress arrives through `onProgress`; aborting `signal` rejects with
 * piscina's AbortError and ends the thread.
 */
export async function runDesignInWorker(
  pool: Piscina,
  job: {
    definition: unknown;
    spec: unknown;
    compareWith?: unknown;
    /** The web process's busy flag: the search waits at its passes while it is set. */
    fieldworkBusy?: Int32Array;
  },
  hooks: { onProgress?: (progress: DesignProgress) => void; signal?: AbortSignal } = {},
): Promise<DesignWorkerResult> {
  const channel = new MessageChannel();
  channel.port1.on('message', (message: DesignProgressMessage) => {
    if (message?.type === 'progress') hooks.onProgress?.(message.progress);
  });
  try {
    return (await pool.run(
      { ...job, port: channel.port2 },
      { transferList: [channel.port2], signal: hooks.signal },
    )) as DesignWorkerResult;
  } finally {
    channel.port1.close();
  }
}
