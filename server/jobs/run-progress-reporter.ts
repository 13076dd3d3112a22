/**
 * What a running estimation writes while it works: its progress on every report from the
 * engine and a heartbeat every HEARTBEAT_MS (the stale-run sweep takes silence for a lost
 * worker), with the due checkpoint (run-checkpoints.ts). Each write first reads the run: a cancel
 * request, or the run no longer held by this claim (the sweep took it back and another worker
 * may have it), fires `signal` so the engine stops within one evaluation. Writes are chained,
 * never concurrent, and best effort: while the database is unreachable the estimation goes on
 * and the next heartbeat writes again.
 */
import type { AppDeps } from '../deps';
import { getRunForJob, updateRunProgress } from '../../db/queries/runs';
import type { RunProgress } from '../../shared/schemas/run';
import type { MixedLogitCheckpoint } from '../engine/estimation/mixed-logit-checkpoint';
import type { createCheckpointWriter } from './run-checkpoints';

/** How often the worker reports even when the engine is quiet, and checks for cancel. */
const HEARTBEAT_MS = 1000;

type CheckpointWriter = ReturnType<typeof createCheckpointWriter>;

export function createRunProgressReporter(
  deps: AppDeps,
  params: { runId: string; attempt: number },
) {
  const { runId, attempt } = params;
  const started = Date.now();
  const abort = new AbortController();
  let takenOver = false;
  let checkpoints: CheckpointWriter | null = null;
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
        if (row && (row.status !== 'running' || row.attempts !== attempt)) takenOver = true;
        else if (checkpoints && !(await checkpoints.saveIfDue())) takenOver = true;
        if (!row || row.cancelRequested || takenOver) abort.abort();
        else await updateRunProgress(deps.db, { id: runId, progress, attempt });
      })
      .catch((err) => {
        queuedWrite = false;
        deps.logger.warn({ err, runId }, 'run progress not saved');
      });
  };
  const heartbeat = setInterval(report, HEARTBEAT_MS);
  return {
    /** Fires on a cancel request or when the claim lost the run. */
    signal: abort.signal,
    get latest(): RunProgress {
      return latest;
    },
    /** The run is another claim's now: write nothing more. */
    get takenOver(): boolean {
      return takenOver;
    },
    elapsedMs: () => Date.now() - started,
    /** Merges `patch` into the progress and writes it (after the write under way). */
    update(patch: Partial<RunProgress>) {
      latest = { ...latest, ...patch };
      report();
    },
    /** From now on, each write also saves the due checkpoint. */
    useCheckpoints(writer: CheckpointWriter) {
      checkpoints = writer;
    },
    /** The engine's newest checkpoint, saved by a later write when one is due. */
    checkpoint(checkpoint: MixedLogitCheckpoint) {
      checkpoints?.offer(checkpoint);
    },
    /** Stops the heartbeat and waits for the last write. */
    async stop() {
      clearInterval(heartbeat);
      await writing;
    },
  };
}
