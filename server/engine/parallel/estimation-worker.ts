/**
 * Piscina worker entry for estimation runs: lowers its own CPU priority, runs the pure
 * runEstimation (MNL, mixed logit, HB, latent class, WTP, taste profiles) off the caller's thread, posts progress
 * on the task's port, and returns known engine errors in the transport form
 * (engine-error-transport.ts) so their classes survive the thread boundary. Cancellation: the caller aborts piscina's `run`, which ends this thread and
 * the mixed logit's slice threads it started.
 */
import { MessagePort } from 'node:worker_threads';
import { runEstimation } from '../estimation/run-estimation';
import type {
  EstimationProgressMessage,
  EstimationWorkerResult,
  EstimationWorkerTask,
} from './estimation-worker-messages';
import { lowerThreadPriority } from './thread-priority';
import { toTransportedError } from './engine-error-transport';

lowerThreadPriority();

function assertTask(message: unknown): asserts message is EstimationWorkerTask {
  const m = message as Partial<EstimationWorkerTask> | null;
  if (
    !m ||
    typeof m !== 'object' ||
    !m.spec ||
    !m.built?.data ||
    !Number.isInteger(m.threads) ||
    (m.port !== undefined && !(m.port instanceof MessagePort)) ||
    (m.fieldworkBusy !== undefined && !(m.fieldworkBusy instanceof Int32Array))
  )
    throw new TypeError('Malformed estimation task');
}

export async function runEstimationTask(message: unknown): Promise<EstimationWorkerResult> {
  assertTask(message);
  const { spec, built, threads, kernel, membership, resume, fieldworkBusy, port } = message;
  const post = (m: EstimationProgressMessage) => port?.postMessage(m);
  try {
    const result = await runEstimation(spec, built, {
      threads,
      kernel,
      membership,
      resume,
      fieldworkBusy,
      onCheckpoint: (checkpoint) => post({ type: 'checkpoint', checkpoint }),
      onNote: (note) => post({ type: 'note', note }),
      onProgress: (progress) => post({ type: 'progress', progress }),
      onSamplerProgress: (progress) => post({ type: 'sampler', progress }),
      onClassProgress: (progress) => post({ type: 'classes', progress }),
      onStage: (stage) => post({ type: 'stage', stage }),
    });
    return { ok: true, result };
  } catch (e) {
    return toTransportedError(e);
  } finally {
    port?.close();
  }
}

// Piscina loads TypeScript workers through tsx only via the default export (see
// server/engine/design/design-worker.ts).
export default runEstimationTask;
