/**
 * The estimation job: a worker claims the run, prepares the study's choice data, runs the
 * engine (MNL on this thread; the mixed logit's log-likelihood on piscina worker threads),
 * writes progress every iteration plus a heartbeat, stops when the user cancels, and always
 * leaves the run finished: done (results + one taste profile per respondent), failed with a
 * readable reason, or cancelled. A run whose worker died is failed by the sweep.
 */
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { AppError } from '../lib/errors';
import { defineJobKind } from './queue';
import {
  claimRun,
  failStaleRuns,
  finishRun,
  getRunForJob,
  setRunDataHash,
  updateRunProgress,
} from '../../db/queries/runs';
import { replaceTasteProfiles } from '../../db/queries/taste-profiles';
import {
  hashChoiceData,
  loadStudyChoiceData,
  toBuiltChoiceData,
} from '../services/choice-data-from-study';
import { ESTIMATION_JOB } from '../services/runs';
import { splitStoredSpec } from '../services/estimation/run-view';
import { getSpecColumns, runEstimation } from '../engine/estimation/run-estimation';
import { ChoiceDataError } from '../engine/estimation/choice-data';
import {
  EstimationCancelledError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../engine/estimation/estimation-errors';
import type { RunProgress, RunResult } from '../../shared/schemas/run';

export const estimationJobDataSchema = z.object({ runId: z.uuid() });

/** How often the worker reports even when the engine is quiet, and checks for cancel. */
const HEARTBEAT_MS = 1000;
/** A running run silent this long has lost its worker. */
export const STALE_RUN_MS = 2 * 60_000;
/** Default BFGS iteration limit of the mixed logit (check-mixed-logit-options.ts). */
const MIXED_MAX_ITERATIONS = 300;

export const WORKER_LOST_ERROR =
  'The worker running this model stopped unexpectedly (a crash or a restart). Start the run again.';

/** A message an analyst can act on, for errors the data or the model explain. */
export function describeRunError(err: unknown): string | null {
  if (err instanceof AppError) return err.message;
  if (err instanceof ChoiceDataError) return `The choice data cannot be used: ${err.message}.`;
  if (err instanceof EstimationOptionsError)
    return `The model specification cannot be used: ${err.message}.`;
  if (err instanceof NonIdentifiedError)
    return `The model cannot be estimated from these data: ${err.message}.`;
  if (err instanceof Error && /not finite at the starting values/.test(err.message))
    return 'The log-likelihood is not finite at the starting values; check the coding and scale of the attributes.';
  return null;
}

export interface EstimationJobOptions {
  /**
   * Worker threads for the mixed logit's log-likelihood (default: the WORKER_THREADS setting,
   * at least 2). With one thread the evaluation would run on this thread and starve the event
   * loop, so heartbeats and cancel checks would wait until the end of the estimation.
   */
  threads?: number;
}

/** Runs one estimation run to its end; used by the queue handler and, in-process, by tests. */
export async function runEstimationJob(
  deps: AppDeps,
  runId: string,
  options: EstimationJobOptions = {},
): Promise<void> {
  const run = await claimRun(deps.db, { id: runId });
  if (!run) {
    const row = await getRunForJob(deps.db, { id: runId });
    if (row && row.status === 'queued')
      await finishRun(deps.db, { id: runId, status: 'cancelled' });
    return;
  }
  const started = Date.now();
  const abort = new AbortController();
  let latest: RunProgress = { stage: 'preparing' };
  let writing = Promise.resolve();
  let queuedWrite = false;
  const report = () => {
    if (queuedWrite) return;
    queuedWrite = true;
    writing = writing.then(async () => {
      queuedWrite = false;
      const progress = {
        ...latest,
        elapsedMs: Date.now() - started,
        heartbeatAt: new Date().toISOString(),
      };
      const row = await getRunForJob(deps.db, { id: runId });
      if (!row || row.cancelRequested) abort.abort();
      else await updateRunProgress(deps.db, { id: runId, progress });
    });
  };
  const heartbeat = setInterval(report, HEARTBEAT_MS);
  try {
    const { spec, respondents } = splitStoredSpec(run.spec);
    const prepared = await loadStudyChoiceData(deps.db, {
      studyId: run.studyId,
      filterId: respondents.filterId,
    });
    const keys = getSpecColumns(spec);
    const built = toBuiltChoiceData(prepared, keys);
    await setRunDataHash(deps.db, {
      id: runId,
      dataHash: hashChoiceData(prepared, keys),
      seed: spec.model === 'mixed' ? spec.draws.seed : null,
    });
    latest = {
      stage: 'estimating',
      ...(spec.model === 'mixed'
        ? {
            maxIterations:
              (spec.settings.maxIterations ?? MIXED_MAX_ITERATIONS) * (spec.starts ?? 3),
          }
        : {}),
    };
    report();
    let offset = 0;
    let lastStart = 1;
    const result = await runEstimation(spec, built, {
      threads: options.threads ?? Math.max(2, deps.env.WORKER_THREADS),
      kernel: deps.env.ESTIMATION_KERNEL,
      signal: abort.signal,
      onNote: (note) => deps.logger.warn({ runId }, note),
      onProgress: (p) => {
        if (p.start !== lastStart) {
          offset = latest.iteration ?? offset;
          lastStart = p.start;
        }
        latest = {
          ...latest,
          stage: 'estimating',
          iteration: offset + p.iteration,
          loglik: p.loglik,
          gradientNorm: p.gradientNorm,
          secondsLeft: Number.isFinite(p.secondsLeft) ? Math.round(p.secondsLeft) : undefined,
          initialGradientNorm: latest.initialGradientNorm ?? p.gradientNorm,
          start: p.start,
        };
        report();
      },
      onStage: (stage) => {
        latest = { ...latest, stage, secondsLeft: undefined };
        report();
      },
    });
    latest = { ...latest, stage: 'saving' };
    report();
    clearInterval(heartbeat);
    await writing;
    if (abort.signal.aborted || (await getRunForJob(deps.db, { id: runId }))?.cancelRequested)
      throw new EstimationCancelledError();
    const { individuals, ...rest } = result;
    const names = new Map(prepared.columns.map((c) => [c.key, c.name]));
    const stored: RunResult = {
      ...rest,
      individuals: null,
      columns: spec.coefficients.map((c) => ({
        key: c.column ?? c.name,
        coefficient: c.name,
        label: names.get(c.column ?? c.name) ?? c.name,
      })),
      data: prepared.summary,
    };
    await deps.db.transaction(async (tx) => {
      await replaceTasteProfiles(tx, {
        runId,
        profiles: (individuals ?? []).map((p) => ({
          respondentId: p.respondent,
          mean: p.mean,
          sd: p.sd,
          wtp: p.wtp ?? null,
          effectiveDraws: p.effectiveDraws,
        })),
      });
      await finishRun(tx, {
        id: runId,
        status: 'done',
        results: stored,
        progress: {
          ...latest,
          stage: 'saving',
          iteration: result.iterations,
          loglik: result.loglik,
          gradientNorm: result.convergence.gradientNorm,
          elapsedMs: Date.now() - started,
          heartbeatAt: new Date().toISOString(),
        },
      });
    });
  } catch (err) {
    clearInterval(heartbeat);
    await writing.catch(() => undefined);
    if (abort.signal.aborted || err instanceof EstimationCancelledError) {
      await finishRun(deps.db, { id: runId, status: 'cancelled' });
      return;
    }
    const readable = describeRunError(err);
    if (!readable) deps.logger.error({ err, runId }, 'estimation run failed');
    await finishRun(deps.db, {
      id: runId,
      status: 'failed',
      error: readable ?? 'The model could not be estimated because of an internal error.',
    });
  }
}

/** Fails runs left running by a worker that died; run at worker start and every minute. */
export async function sweepStaleRuns(deps: AppDeps, now = Date.now()): Promise<string[]> {
  const failed = await failStaleRuns(deps.db, {
    silentSince: new Date(now - STALE_RUN_MS),
    error: WORKER_LOST_ERROR,
  });
  if (failed.length > 0) deps.logger.warn({ ids: failed }, 'failed stale estimation runs');
  return failed.map((r) => r.id);
}

/** The queue registration. */
export function createEstimationJobKind() {
  return defineJobKind({
    name: ESTIMATION_JOB,
    schema: estimationJobDataSchema,
    expireInMinutes: 180,
    handle: async (data, { deps }) => runEstimationJob(deps, data.runId),
    sweep: async (deps) => {
      await sweepStaleRuns(deps);
    },
  });
}
