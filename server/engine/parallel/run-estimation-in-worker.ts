/**
 * Runs estimation runs on piscina worker threads, so that neither the web process's request
 * thread nor a worker process's job loop (heartbeats, cancel checks, other jobs) waits for
 * the numerics. The worker file is TypeScript; threads start from its prebuilt bundle or through
 * the tsx loader (ts-worker-pool.ts), as for the design pool.
 *
 *   const pool = createEstimationPool({ maxThreads: 1 });
 *   const result = await runEstimationInWorker(pool, { spec, built, threads: 2 }, { onProgress, signal });
 *   await pool.destroy();
 */
import { fileURLToPath } from 'node:url';
import { MessageChannel } from 'node:worker_threads';
import type { Piscina } from 'piscina';
import { createTsPiscina } from './ts-worker-pool';
import type { EstimationResult } from '../../../shared/schemas/estimation-spec';
import { EstimationCancelledError } from '../estimation/estimation-errors';
import type { EstimationProgress, EstimationStage } from '../estimation/fit-mixed-logit';
import type { MixedLogitCheckpoint } from '../estimation/mixed-logit-checkpoint';
import type { HbProgress } from '../hb/fit-hb';
import type { LatentClassProgress } from '../latent-class/fit-latent-class';
import type {
  EstimationProgressMessage,
  EstimationWorkerResult,
  EstimationWorkerTask,
} from './estimation-worker-messages';
import type { EngineThreadData } from './thread-priority';
import { unwrapWorkerResult } from './engine-error-transport';

const WORKER_FILE = fileURLToPath(new URL('./estimation-worker.ts', import.meta.url));

/** A pool of estimation threads; maxThreads bounds how many runs estimate at once. */
export function createEstimationPool(
  options: { maxThreads?: number; nice?: number } = {},
): Piscina {
  return createTsPiscina({
    filename: WORKER_FILE,
    minThreads: 0,
    maxThreads: options.maxThreads ?? 1,
    workerData: { nice: options.nice } satisfies EngineThreadData,
    // A finished thread is kept a while for the next run, then gives its memory back.
    idleTimeout: 60_000,
  });
}

/**
 * Runs one estimation; progress arrives through `onProgress`; aborting `signal` ends the
 * thread and rejects with EstimationCancelledError. Engine errors are rethrown as their own
 * classes (ChoiceDataError, EstimationOptionsError, NonIdentifiedError, EstimationFailedError).
 */
export async function runEstimationInWorker(
  pool: Piscina,
  task: Omit<EstimationWorkerTask, 'port'>,
  hooks: {
    onProgress?: (progress: EstimationProgress) => void;
    onSamplerProgress?: (progress: HbProgress) => void;
    onClassProgress?: (progress: LatentClassProgress) => void;
    onStage?: (stage: EstimationStage) => void;
    onNote?: (note: string) => void;
    onCheckpoint?: (checkpoint: MixedLogitCheckpoint) => void;
    signal?: AbortSignal;
  } = {},
): Promise<EstimationResult> {
  const channel = new MessageChannel();
  channel.port1.on('message', (message: EstimationProgressMessage) => {
    if (message?.type === 'progress') hooks.onProgress?.(message.progress);
    else if (message?.type === 'sampler') hooks.onSamplerProgress?.(message.progress);
    else if (message?.type === 'classes') hooks.onClassProgress?.(message.progress);
    else if (message?.type === 'stage') hooks.onStage?.(message.stage);
    else if (message?.type === 'note') hooks.onNote?.(message.note);
    else if (message?.type === 'checkpoint') hooks.onCheckpoint?.(message.checkpoint);
  });
  try {
    const out = (await pool.run(
      { ...task, port: channel.port2 },
      { transferList: [channel.port2], signal: hooks.signal },
    )) as EstimationWorkerResult;
    return unwrapWorkerResult(out).result;
  } catch (err) {
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    throw err;
  } finally {
    channel.port1.close();
  }
}
