/**
 * Runs whose worker was lost. A running run beats every second (estimation-job.ts); one that
 * has been silent for STALE_RUN_MS lost its worker (a crash, a SIGKILL, a restart, the machine
 * running out of memory). The sweep, which every worker runs at start and every minute, puts
 * such a run back in the queue, and the worker that takes it goes on from its last checkpoint
 * (run-checkpoints.ts). A run that has lost its worker MAX_RUN_ATTEMPTS times is failed with the
 * reason instead: a model that kills its worker again and again (most often by needing more
 * memory than the machine has) must not keep a queue busy for ever.
 */
import type { AppDeps } from '../deps';
import type { JobSender } from './queue';
import { failStaleRuns, requeueStaleRuns } from '../../db/queries/runs';
import { deleteRunCheckpoint } from '../../db/queries/run-checkpoints';
import { ESTIMATION_JOB } from '../services/runs';

/** A running run silent this long has lost its worker. */
export const STALE_RUN_MS = 2 * 60_000;
/** Claims of one run by a worker: the first, then at most two resumes after a worker loss. */
export const MAX_RUN_ATTEMPTS = 3;

export const WORKER_LOST_ERROR = `The worker running this model stopped unexpectedly ${MAX_RUN_ATTEMPTS} times (a crash, a restart or the machine running out of memory), so it was not resumed again. Start the run again; if memory is short, with fewer draws or respondents.`;

/**
 * Resumes (queues again, its job sent in the same transaction) or fails the runs whose worker
 * has been silent since `now - STALE_RUN_MS`. Without a queue to send to, only the runs past
 * their last attempt are failed; the others wait for a sweep that has one.
 */
export async function sweepStaleRuns(
  deps: AppDeps,
  now = Date.now(),
  jobs: JobSender | null = deps.jobs ?? null,
): Promise<{ resumed: string[]; failed: string[] }> {
  const silentSince = new Date(now - STALE_RUN_MS);
  const failed = (
    await failStaleRuns(deps.db, {
      silentSince,
      error: WORKER_LOST_ERROR,
      minAttempts: MAX_RUN_ATTEMPTS,
    })
  ).map((r) => r.id);
  for (const runId of failed) await deleteRunCheckpoint(deps.db, { runId });
  const resumed = jobs
    ? await deps.db.transaction(async (tx) => {
        const rows = await requeueStaleRuns(tx, { silentSince, maxAttempts: MAX_RUN_ATTEMPTS });
        for (const row of rows) await jobs.send(ESTIMATION_JOB, { runId: row.id }, { tx });
        return rows.map((r) => r.id);
      })
    : [];
  if (failed.length > 0)
    deps.logger.warn({ ids: failed }, 'failed estimation runs that lost their worker too often');
  if (resumed.length > 0)
    deps.logger.warn({ ids: resumed }, 'queued again estimation runs that lost their worker');
  return { resumed, failed };
}
