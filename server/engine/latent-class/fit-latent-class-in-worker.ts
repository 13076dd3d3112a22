/**
 * Runs fitLatentClass on a worker thread (piscina), so EM never blocks the calling thread; with
 * threads ≤ 1 (the command line) it runs in-process. Cancel and progress go through a shared
 * control array polled every half second. Between EM iterations the fit waits while the web
 * process's fieldwork flag is busy (parallel/fieldwork-yield.ts).
 */
import { fileURLToPath } from 'node:url';
import type { ChoiceData } from '../estimation/choice-data';
import { unwrapWorkerResult } from '../parallel/engine-error-transport';
import { createTsWorkerPool, shareChoiceData } from '../parallel/ts-worker-pool';
import { waitWhileBusy } from '../parallel/fieldwork-yield';
import type { LatentClassOptions } from './check-latent-class-options';
import {
  fitLatentClass,
  type LatentClassProgress,
  type LatentClassResult,
} from './fit-latent-class';

const WORKER_FILE = fileURLToPath(new URL('../parallel/latent-class-worker.ts', import.meta.url));
const POLL_MS = 500;

export async function fitLatentClassInWorker(
  data: ChoiceData,
  options: LatentClassOptions,
  hooks: {
    onProgress?: (p: LatentClassProgress) => void;
    signal?: AbortSignal;
    threads?: number;
    /** The web process's busy flag: EM waits between its iterations while it is set. */
    fieldworkBusy?: Int32Array;
  } = {},
): Promise<LatentClassResult> {
  const busy = hooks.fieldworkBusy;
  if ((hooks.threads ?? 1) <= 1)
    return fitLatentClass(data, options, {
      onProgress: hooks.onProgress,
      shouldStop: () => {
        if (busy) waitWhileBusy(busy);
        return hooks.signal?.aborted === true;
      },
    });
  const pool = createTsWorkerPool(WORKER_FILE, 'handleLatentClassMessage', 1);
  const control = new Int32Array(new SharedArrayBuffer(12));
  const starts = options.starts ?? 10;
  let last = '';
  const timer = setInterval(() => {
    if (hooks.signal?.aborted) Atomics.store(control, 0, 1);
    const classes = Atomics.load(control, 1);
    const start = Atomics.load(control, 2);
    if (classes === 0 || `${classes}/${start}` === last) return;
    last = `${classes}/${start}`;
    hooks.onProgress?.({ classes, start, starts });
  }, POLL_MS);
  try {
    const result = await pool.run({ data: shareChoiceData(data), options, control, busy });
    return unwrapWorkerResult<LatentClassResult>(result as LatentClassResult);
  } finally {
    clearInterval(timer);
    await pool.destroy();
  }
}
