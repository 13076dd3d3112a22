/**
 * Messages between an estimation job and the thread that runs the engine. Progress goes over
 * a MessagePort passed in the task (transferred); the result is a plain object. Errors the
 * analyst can act on come back in the engine's error transport (engine-error-transport.ts),
 * because classes do not survive a thread boundary.
 */
import type { MessagePort } from 'node:worker_threads';
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { BuiltChoiceData } from '../estimation/build-choice-data';
import type { EstimationProgress } from '../estimation/fit-mixed-logit';
import type { TransportedError } from './engine-error-transport';

export interface EstimationWorkerTask {
  spec: EstimationSpec;
  built: BuiltChoiceData;
  /** Threads of the mixed logit's log-likelihood, started from the engine thread. */
  threads: number;
  port?: MessagePort;
}

export type EstimationWorkerResult = { ok: true; result: EstimationResult } | TransportedError;

export interface EstimationProgressMessage {
  type: 'progress';
  progress: EstimationProgress;
}
