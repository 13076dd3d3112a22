/**
 * Piscina worker entry for estimation runs: lowers its own CPU priority, runs the pure
 * runEstimation (MNL, mixed logit, WTP, taste profiles) off the caller's thread, posts progress
 * on the task's port, and returns a tagged result so the engine's error kinds survive the
 * thread boundary. Cancellation: the caller aborts piscina's `run`, which ends this thread and
 * the mixed logit's slice threads it started.
 */
import { MessagePort } from 'node:worker_threads';
import { ChoiceDataError } from '../estimation/choice-data';
import {
  EstimationCancelledError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../estimation/estimation-errors';
import { runEstimation } from '../estimation/run-estimation';
import type {
  EstimationProgressMessage,
  EstimationWorkerResult,
  EstimationWorkerTask,
} from './estimation-worker-messages';
import { lowerThreadPriority } from './thread-priority';

lowerThreadPriority();

function assertTask(message: unknown): asserts message is EstimationWorkerTask {
  const m = message as Partial<EstimationWorkerTask> | null;
  if (
    !m ||
    typeof m !== 'object' ||
    !m.spec ||
    !m.built?.data ||
    !Number.isInteger(m.threads) ||
    (m.port !== undefined && !(m.port instanceof MessagePort))
  )
    throw new TypeError('Malformed estimation task');
}

export async function runEstimationTask(message: unknown): Promise<EstimationWorkerResult> {
  assertTask(message);
  const { spec, built, threads, port } = message;
  try {
    const result = await runEstimation(spec, built, {
      threads,
      onProgress: (progress) =>
        port?.postMessage({ type: 'progress', progress } satisfies EstimationProgressMessage),
    });
    return { ok: true, result };
  } catch (e) {
    if (e instanceof ChoiceDataError)
      return {
        ok: false,
        error: { kind: 'choice_data', message: e.message, field: e.field, line: e.line },
      };
    if (e instanceof EstimationOptionsError)
      return { ok: false, error: { kind: 'options', message: e.message, field: e.field } };
    if (e instanceof NonIdentifiedError)
      return {
        ok: false,
        error: { kind: 'not_identified', message: e.message, parameters: [...e.parameters] },
      };
    if (e instanceof EstimationCancelledError)
      return { ok: false, error: { kind: 'cancelled', message: e.message } };
    throw e;
  } finally {
    port?.close();
  }
}

// Piscina loads TypeScript workers through tsx only via the default export (see
// server/engine/design/design-worker.ts).
export default runEstimationTask;
