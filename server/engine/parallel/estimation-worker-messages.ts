/**
 * Messages between an estimation job and the thread that runs the engine. Progress goes over
 * a MessagePort passed in the task (transferred); the result is a plain object. Errors the
 * analyst can act on come back in the engine's error transport (engine-error-transport.ts),
 * because classes do not survive a thread boundary.
 */
import type { MessagePort } from 'node:worker_threads';
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { BuiltChoiceData } from '../estimation/build-choice-data';
import type { EstimationProgress, EstimationStage } from '../estimation/fit-mixed-logit';
import type { TransportedError } from './engine-error-transport';
import type { KernelPreference } from '../simd/kernel-choice';
import type { HbProgress } from '../hb/fit-hb';
import type { LatentClassProgress } from '../latent-class/fit-latent-class';
import type { MembershipCovariates } from '../latent-class/check-latent-class-options';
import type { MixedLogitCheckpoint } from '../estimation/mixed-logit-checkpoint';

export interface EstimationWorkerTask {
  spec: EstimationSpec;
  built: BuiltChoiceData;
  /** Threads of the mixed logit's log-likelihood, started from the engine thread. */
  threads: number;
  /** Kernel of the mixed logit's LL (default 'auto'). */
  kernel?: KernelPreference;
  /** Latent class: covariates of the membership model, rows in built.data.respondentIds order. */
  membership?: MembershipCovariates | null;
  /** Mixed logit: an interrupted attempt's checkpoint to go on from. */
  resume?: MixedLogitCheckpoint;
  /** The web process's busy flag (fieldwork-yield.ts): the mixed logit waits while it is set. */
  fieldworkBusy?: Int32Array;
  port?: MessagePort;
}

export type EstimationWorkerResult = { ok: true; result: EstimationResult } | TransportedError;

export type EstimationProgressMessage =
  | { type: 'progress'; progress: EstimationProgress }
  /** HB: sampler iterations of the slowest chain. */
  | { type: 'sampler'; progress: HbProgress }
  /** Latent class: EM starts done per number of classes. */
  | { type: 'classes'; progress: LatentClassProgress }
  /** A stage after the optimisation began (standard errors, WTP, taste profiles). */
  | { type: 'stage'; stage: EstimationStage }
  /** Mixed logit: where the fit stands after a BFGS iteration (the job decides what to keep). */
  | { type: 'checkpoint'; checkpoint: MixedLogitCheckpoint }
  /** A remark for the run's log (for example, a kernel that fell back to TypeScript). */
  | { type: 'note'; note: string };
