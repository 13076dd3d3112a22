/**
 * The estimation job: a worker claims the run, prepares the study's choice data, runs the
 * engine on a worker thread (MNL, mixed logit, WTP and taste profiles; the mixed logit's
 * log-likelihood on further threads), writes progress every iteration plus a heartbeat, stops
 * when the user cancels, and always leaves the run finished: done (results + one taste
 * profile per respondent), failed with a readable reason, or cancelled. A run whose worker
 * died is failed by the sweep.
 */
import { z } from 'zod';
import type { Piscina } from 'piscina';
import type { AppDeps } from '../deps';
import { AppError } from '../lib/errors';
import { retryWhileDatabaseUnavailable } from '../lib/db-retry';
import { defineJobKind } from './queue';
import { sweepOrphans, type OrphanSpec } from './orphan-sweep';
import {
  claimRun,
  failQueuedRuns,
  failStaleRuns,
  listQueuedRuns,
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
import { getRunSeed, splitStoredSpec } from '../services/estimation/run-view';
import { loadMembershipCovariates } from '../services/estimation/study-membership';
import { getSpecColumns } from '../engine/estimation/run-estimation';
import {
  createEstimationPool,
  runEstimationInWorker,
} from '../engine/parallel/run-estimation-in-worker';
import { ChoiceDataError } from '../engine/estimation/choice-data';
import {
  EstimationCancelledError,
  EstimationFailedError,
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

/** The latent class counts a spec asks for, as [fewest, most] (default 2). */
function classRange(classes: number | [number, number] | undefined): [number, number] {
  if (Array.isArray(classes)) return classes;
  return [classes ?? 2, classes ?? 2];
}

/** A message an analyst can act on, for errors the data or the model explain. */
export function describeRunError(err: unknown): string | null {
  if (err instanceof AppError) return err.message;
  if (err instanceof ChoiceDataError) return `The choice data cannot be used: ${err.message}.`;
  if (err instanceof EstimationOptionsError)
    return `The model specification cannot be used: ${err.message}.`;
  if (err instanceof NonIdentifiedError)
    return `The model cannot be estimated from these data: ${err.message}.`;
  if (err instanceof EstimationFailedError) return `The estimation failed: ${err.message}`;
  if (err instanceof Error && /not finite at the starting values/.test(err.message))
    return 'The log-likelihood is not finite at the starting values; check the coding and scale of the attributes.';
  return null;
}

export interface EstimationJobOptions {
  /** Worker threads for the mixed logit's log-likelihood (default: the WORKER_THREADS setting). */
  threads?: number;
  /** The thread pool the engine runs on (default: a pool of one thread for this run). */
  pool?: Piscina;
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
    writing = writing
      .then(async () => {
        queuedWrite = false;
        const progress = {
          ...latest,
          elapsedMs: Date.now() - started,
          heartbeatAt: new Date().toISOString(),
        };
        const row = await getRunForJob(deps.db, { id: runId });
        if (!row || row.cancelRequested) abort.abort();
        else await updateRunProgress(deps.db, { id: runId, progress });
      })
      // Progress is best effort: while the database is unreachable the estimation goes on,
      // and the next heartbeat writes again.
      .catch((err) => {
        queuedWrite = false;
        deps.logger.warn({ err, runId }, 'run progress not saved');
      });
  };
  const heartbeat = setInterval(report, HEARTBEAT_MS);
  // A finished estimation is not thrown away because PostgreSQL restarts while it is saved.
  const persist = <T>(write: () => Promise<T>) =>
    retryWhileDatabaseUnavailable(write, {
      onRetry: () => deps.logger.warn({ runId }, 'database unreachable; saving the run again'),
    });
  try {
    const { spec, respondents } = splitStoredSpec(run.spec);
    const keys = getSpecColumns(spec);
    const prepared = await persist(() =>
      loadStudyChoiceData(deps.db, { studyId: run.studyId, filterId: respondents.filterId }),
    );
    const built = toBuiltChoiceData(prepared, keys);
    const membership = await persist(() =>
      loadMembershipCovariates(deps.db, { id: run.studyId }, spec, built.data.respondentIds),
    );
    await persist(() =>
      setRunDataHash(deps.db, {
        id: runId,
        dataHash: hashChoiceData(prepared, keys),
        seed: getRunSeed(spec),
      }),
    );
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
    const pool = options.pool ?? createEstimationPool({ nice: deps.env.ENGINE_THREAD_NICE });
    const result = await runEstimationInWorker(
      pool,
      {
        spec,
        built,
        threads: options.threads ?? deps.env.WORKER_THREADS,
        kernel: deps.env.ESTIMATION_KERNEL,
        membership,
      },
      {
        signal: abort.signal,
        // HB: iterations of the slowest chain; latent class: starts done over all class counts.
        onSamplerProgress: (p) => {
          latest = { ...latest, iteration: p.iteration, maxIterations: p.iterations };
          report();
        },
        onClassProgress: (p) => {
          const [fewest, most] = classRange(spec.classes);
          latest = {
            ...latest,
            iteration: (p.classes - fewest) * p.starts + p.start,
            maxIterations: (most - fewest + 1) * p.starts,
          };
          report();
        },
        onStage: (stage) => {
          latest = { ...latest, stage, secondsLeft: undefined };
          report();
        },
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
      },
    ).finally(() => (options.pool ? undefined : pool.destroy()));
    latest = { ...latest, stage: 'saving' };
    report();
    clearInterval(heartbeat);
    await writing;
    const cancelled = await persist(
      async () => (await getRunForJob(deps.db, { id: runId }))?.cancelRequested,
    );
    if (abort.signal.aborted || cancelled) throw new EstimationCancelledError();
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
    await persist(() =>
      deps.db.transaction(async (tx) => {
        await replaceTasteProfiles(tx, {
          runId,
          // HB intervals and latent class probabilities go to `extra`.
          profiles: (individuals ?? []).map(
            ({ respondent, mean, sd, wtp, effectiveDraws, ...extra }) => ({
              respondentId: respondent,
              mean,
              sd,
              wtp: wtp ?? null,
              effectiveDraws,
              extra: Object.keys(extra).length > 0 ? extra : null,
            }),
          ),
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
            // The HB sampler has no gradient (null), and the progress schema wants a number.
            gradientNorm: result.convergence.gradientNorm ?? undefined,
            elapsedMs: Date.now() - started,
            heartbeatAt: new Date().toISOString(),
          },
        });
      }),
    );
  } catch (err) {
    clearInterval(heartbeat);
    await writing.catch(() => undefined);
    if (abort.signal.aborted || err instanceof EstimationCancelledError) {
      await persist(() => finishRun(deps.db, { id: runId, status: 'cancelled' }));
      return;
    }
    const readable = describeRunError(err);
    if (!readable) deps.logger.error({ err, runId }, 'estimation run failed');
    await persist(() =>
      finishRun(deps.db, {
        id: runId,
        status: 'failed',
        error: readable ?? 'The model could not be estimated because of an internal error.',
      }),
    );
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

const ORPHANED_RUNS: OrphanSpec = {
  jobName: ESTIMATION_JOB,
  idField: 'runId',
  listQueued: listQueuedRuns,
  failQueued: failQueuedRuns,
  reason: 'The job queue lost this run before a worker could take it. Start the run again.',
};

/** The queue registration. */
export function createEstimationJobKind() {
  // One engine thread per worker: runs estimate one after the other, each with
  // WORKER_THREADS threads for the mixed logit's log-likelihood.
  let pool: Piscina | null = null;
  return defineJobKind({
    name: ESTIMATION_JOB,
    schema: estimationJobDataSchema,
    expireInMinutes: 180,
    handle: async (data, { deps }) =>
      runEstimationJob(deps, data.runId, {
        pool: (pool ??= createEstimationPool({ nice: deps.env.ENGINE_THREAD_NICE })),
      }),
    sweep: async (deps, queue) => {
      await sweepStaleRuns(deps);
      if (queue) await sweepOrphans(deps, queue, ORPHANED_RUNS);
    },
    close: async () => {
      await pool?.destroy();
      pool = null;
    },
  });
}
