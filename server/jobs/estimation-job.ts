/**
 * The estimation job: a worker claims the run, prepares the study's choice data, runs the
 * engine on a worker thread (MNL, mixed logit, WTP and taste profiles; the mixed logit's
 * log-likelihood on further threads), writes progress every iteration plus a heartbeat, stops
 * when the user cancels, and always leaves the run finished: done (results + one taste
 * profile per respondent), failed with a readable reason, or cancelled. A mixed logit also
 * saves a checkpoint every few seconds (run-checkpoints.ts): a run whose worker died is queued
 * again by the sweep (stale-run-sweep.ts) and goes on from there. Every write of the job is
 * fenced by its claim (runs.attempts), so a worker presumed dead that comes back writes nothing.
 */
import { z } from 'zod';
import type { Piscina } from 'piscina';
import { lazyPool } from './lazy-pool';
import type { AppDeps } from '../deps';
import { retryWhileDatabaseUnavailable } from '../lib/db-retry';
import { defineJobKind } from './queue';
import { sweepOrphans, type OrphanSpec } from './orphan-sweep';
import { sweepStaleRuns } from './stale-run-sweep';
import { createCheckpointWriter, resumeRun } from './run-checkpoints';
import { describeRunError } from './describe-run-error';
import { createRunProgressReporter } from './run-progress-reporter';
import { deleteRunCheckpoint } from '../../db/queries/run-checkpoints';
import {
  claimRun,
  failQueuedRuns,
  listQueuedRuns,
  finishRun,
  getRunForJob,
  setRunDataHash,
} from '../../db/queries/runs';
import { replaceTasteProfiles } from '../../db/queries/taste-profiles';
import {
  hashChoiceDataInTurns,
  loadRunChoiceData,
  toBuiltChoiceData,
} from '../services/choice-data-from-study';
import { ESTIMATION_JOB } from '../services/runs';
import { getRunSeed } from '../services/estimation/run-view';
import { loadMembershipCovariates } from '../services/estimation/study-membership';
import {
  createEstimationPool,
  runEstimationInWorker,
} from '../engine/parallel/run-estimation-in-worker';
import { EstimationCancelledError } from '../engine/estimation/estimation-errors';
import type { RunResult } from '../../shared/schemas/run';

export const estimationJobDataSchema = z.object({ runId: z.uuid() });

/** Default BFGS iteration limit of the mixed logit (check-mixed-logit-options.ts). */
const MIXED_MAX_ITERATIONS = 300;

/** Thrown inside the job when another claim took the run over: the job writes nothing more. */
class RunTakenOverError extends Error {}

/** The latent class counts a spec asks for, as [fewest, most] (default 2). */
function classRange(classes: number | [number, number] | undefined): [number, number] {
  if (Array.isArray(classes)) return classes;
  return [classes ?? 2, classes ?? 2];
}

export interface EstimationJobOptions {
  /** Worker threads for the mixed logit's log-likelihood (default: the WORKER_THREADS setting). */
  threads?: number;
  /** The thread pool the engine runs on (default: a pool of one thread for this run). */
  pool?: Piscina;
  /** Least time between two checkpoint writes (default CHECKPOINT_EVERY_MS). */
  checkpointEveryMs?: number;
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
  const attempt = run.attempts;
  const progress = createRunProgressReporter(deps, { runId, attempt });
  // A finished estimation is not thrown away because PostgreSQL restarts while it is saved.
  const persist = <T>(write: () => Promise<T>) =>
    retryWhileDatabaseUnavailable(write, {
      onRetry: () => deps.logger.warn({ runId }, 'database unreachable; saving the run again'),
    });
  try {
    // A run read in the old order (queued or resumed across the change) keeps it, so it
    // reproduces and its checkpoint's data hash still matches.
    const { spec, prepared, keys } = await persist(() =>
      loadRunChoiceData(deps.db, { studyId: run.studyId, storedSpec: run.spec }),
    );
    const built = toBuiltChoiceData(prepared, keys);
    const membership = await persist(() =>
      loadMembershipCovariates(deps.db, { id: run.studyId }, spec, built.data.respondentIds),
    );
    const dataHash = await hashChoiceDataInTurns(prepared, keys);
    await persist(() => setRunDataHash(deps.db, { id: runId, dataHash, seed: getRunSeed(spec) }));
    const draws = spec.model === 'mixed' ? spec.draws : null;
    const resume = attempt > 1 ? await resumeRun(deps, { runId, attempt, dataHash, draws }) : null;
    if (attempt > 1)
      progress.update({
        resumed: { attempt, fromIteration: resume?.iteration ?? 0 },
        iteration: resume?.iteration,
      });
    if (draws)
      progress.useCheckpoints(
        createCheckpointWriter(deps, {
          runId,
          attempt,
          dataHash,
          draws,
          everyMs: options.checkpointEveryMs,
        }),
      );
    progress.update({
      stage: 'estimating',
      ...(spec.model === 'mixed'
        ? {
            maxIterations:
              (spec.settings.maxIterations ?? MIXED_MAX_ITERATIONS) * (spec.starts ?? 3),
          }
        : {}),
    });
    // Progress counts iterations over all starts; a resumed run counts those done before.
    let offset = resume?.checkpoint.finished.reduce((sum, r) => sum + r.iterations, 0) ?? 0;
    let lastStart = (resume?.checkpoint.start ?? 0) + 1;
    const pool = options.pool ?? createEstimationPool({ nice: deps.env.ENGINE_THREAD_NICE });
    const result = await runEstimationInWorker(
      pool,
      {
        spec,
        built,
        threads: options.threads ?? deps.env.WORKER_THREADS,
        kernel: deps.env.ESTIMATION_KERNEL,
        membership,
        resume: resume?.checkpoint,
        fieldworkBusy: deps.fieldworkBusy,
      },
      {
        signal: progress.signal,
        // HB: iterations of the slowest chain; latent class: starts done over all class counts.
        onSamplerProgress: (p) =>
          progress.update({ iteration: p.iteration, maxIterations: p.iterations }),
        onClassProgress: (p) => {
          const [fewest, most] = classRange(spec.classes);
          progress.update({
            iteration: (p.classes - fewest) * p.starts + p.start,
            maxIterations: (most - fewest + 1) * p.starts,
          });
        },
        onStage: (stage) => progress.update({ stage, secondsLeft: undefined }),
        onNote: (note) => deps.logger.warn({ runId }, note),
        onCheckpoint: (checkpoint) => progress.checkpoint(checkpoint),
        onProgress: (p) => {
          if (p.start !== lastStart) {
            offset = progress.latest.iteration ?? offset;
            lastStart = p.start;
          }
          progress.update({
            stage: 'estimating',
            iteration: offset + p.iteration,
            loglik: p.loglik,
            gradientNorm: p.gradientNorm,
            secondsLeft: Number.isFinite(p.secondsLeft) ? Math.round(p.secondsLeft) : undefined,
            initialGradientNorm: progress.latest.initialGradientNorm ?? p.gradientNorm,
            start: p.start,
          });
        },
      },
    ).finally(() => (options.pool ? undefined : pool.destroy()));
    progress.update({ stage: 'saving' });
    await progress.stop();
    const cancelled = await persist(
      async () => (await getRunForJob(deps.db, { id: runId }))?.cancelRequested,
    );
    if (progress.signal.aborted || cancelled) throw new EstimationCancelledError();
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
        await deleteRunCheckpoint(tx, { runId });
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
        const finished = await finishRun(tx, {
          id: runId,
          attempt,
          status: 'done',
          results: stored,
          progress: {
            ...progress.latest,
            stage: 'saving',
            iteration: result.iterations,
            loglik: result.loglik,
            // The HB sampler has no gradient (null), and the progress schema wants a number.
            gradientNorm: result.convergence.gradientNorm ?? undefined,
            elapsedMs: progress.elapsedMs(),
            heartbeatAt: new Date().toISOString(),
          },
        });
        // Rolls the profiles back: the run is another claim's now.
        if (!finished) throw new RunTakenOverError();
      }),
    );
  } catch (err) {
    await progress.stop();
    if (progress.takenOver || err instanceof RunTakenOverError) {
      deps.logger.warn({ runId, attempt }, 'run taken over by another worker; this one stops');
      return;
    }
    const cancelled = progress.signal.aborted || err instanceof EstimationCancelledError;
    const readable = cancelled ? null : describeRunError(err);
    if (!cancelled && !readable) deps.logger.error({ err, runId }, 'estimation run failed');
    const ended = await persist(() =>
      finishRun(deps.db, {
        id: runId,
        attempt,
        ...(cancelled
          ? { status: 'cancelled' as const }
          : {
              status: 'failed' as const,
              error: readable ?? 'The model could not be estimated because of an internal error.',
            }),
      }),
    );
    if (ended) await persist(() => deleteRunCheckpoint(deps.db, { runId }));
  }
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
  const pool = lazyPool();
  return defineJobKind({
    name: ESTIMATION_JOB,
    schema: estimationJobDataSchema,
    expireInMinutes: 180,
    handle: async (data, { deps }) =>
      runEstimationJob(deps, data.runId, {
        pool: pool.get(() => createEstimationPool({ nice: deps.env.ENGINE_THREAD_NICE })),
        checkpointEveryMs: deps.env.RUN_CHECKPOINT_EVERY_MS,
      }),
    sweep: async (deps, queue) => {
      await sweepStaleRuns(deps, Date.now(), queue ?? deps.jobs ?? null);
      if (queue) await sweepOrphans(deps, queue, ORPHANED_RUNS);
    },
    close: pool.close,
  });
}
