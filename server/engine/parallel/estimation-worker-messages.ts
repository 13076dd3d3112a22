/**
 * Messages between an estimation job and the thread that runs the engine. Progress goes over
 * a MessagePort passed in the task (transferred); the result is a plain object. Errors the
 * analyst can act on come back tagged, because classes do not survive a thread boundary.
 */
import type { MessagePort } from 'node:worker_threads';
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { BuiltChoiceData } from '../estimation/build-choice-data';
import type { EstimationProgress } from '../estimation/fit-mixed-logit';

export interface EstimationWorkerTask {
  spec: EstimationSpec;
  built: BuiltChoiceData;
  /** Threads of the mixed logit's log-likelihood, started from the engine thread. */
  threads: number;
  port?: MessagePort;
}

export type EstimationErrorKind = 'choice_data' | 'options' | 'not_identified' | 'cancelled';

export type EstimationWorkerResult =
  | { ok: true; result: EstimationResult }
  | {
      ok: false;
      error: {
        kind: EstimationErrorKind;
        message: string;
        field?: string;
        line?: number;
        parameters?: string[];
      };
    };

export interface EstimationProgressMessage {
  type: 'progress';
  progress: EstimationProgress;
}
