/**
 * Checkpoints of running mixed logits, so that a run whose worker is lost goes on from its last
 * iterate instead of iteration 0 (stale-run-sweep.ts queues it again). The engine reports where
 * it stands after every BFGS iteration; the job keeps only the newest report and writes it at
 * most every CHECKPOINT_EVERY_MS (never once per evaluation), and only while its claim still
 * holds the run. A checkpoint is used only for the same choice data (its SHA-256) and draws:
 * if respondents were added or erased in between, the run starts again from the beginning.
 */
import { isDeepStrictEqual } from 'node:util';
import type { AppDeps } from '../deps';
import { retryWhileDatabaseUnavailable } from '../lib/db-retry';
import {
  countCheckpointIterations,
  type MixedLogitCheckpoint,
} from '../engine/estimation/mixed-logit-checkpoint';
import { getRunCheckpoint, saveRunCheckpoint } from '../../db/queries/run-checkpoints';
import { decodeCheckpoint, encodeCheckpoint } from './run-checkpoint-codec';

/** At most one checkpoint write per run this often. */
export const CHECKPOINT_EVERY_MS = 5_000;

export type ResumePoint = {
  checkpoint: MixedLogitCheckpoint;
  /** Iterations over all starts the checkpoint had done. */
  iteration: number;
};

/** The checkpoint a run taken up again can go on from, or null (the reason is logged). */
export async function loadResumePoint(
  deps: AppDeps,
  params: { runId: string; dataHash: string; draws: unknown },
): Promise<ResumePoint | null> {
  const row = await getRunCheckpoint(deps.db, { runId: params.runId });
  if (!row) return null;
  const skip = (why: string) => {
    deps.logger.warn({ runId: params.runId }, `checkpoint not used: ${why}`);
    return null;
  };
  if (row.dataHash !== params.dataHash) return skip('the choice data changed since it was saved');
  let decoded: ReturnType<typeof decodeCheckpoint>;
  try {
    decoded = decodeCheckpoint(row.state);
  } catch (err) {
    deps.logger.warn({ err, runId: params.runId }, 'checkpoint not readable');
    return null;
  }
  // Stored as jsonb, whose objects do not keep their key order.
  if (!isDeepStrictEqual(decoded.draws, JSON.parse(JSON.stringify(params.draws))))
    return skip('it was made with other draws');
  return {
    checkpoint: decoded.checkpoint,
    iteration: countCheckpointIterations(decoded.checkpoint),
  };
}

/** Keeps the engine's newest checkpoint and saves it when one is due. */
export function createCheckpointWriter(
  deps: AppDeps,
  params: { runId: string; attempt: number; dataHash: string; draws: unknown; everyMs?: number },
) {
  const everyMs = params.everyMs ?? CHECKPOINT_EVERY_MS;
  let pending: MixedLogitCheckpoint | null = null;
  let savedAt = -Infinity;
  return {
    offer(checkpoint: MixedLogitCheckpoint) {
      pending = checkpoint;
    },
    /** Writes the newest checkpoint if one is due; false when the claim lost the run. */
    async saveIfDue(now = Date.now()): Promise<boolean> {
      if (!pending || now - savedAt < everyMs) return true;
      const checkpoint = pending;
      pending = null;
      savedAt = now;
      return saveRunCheckpoint(deps.db, {
        runId: params.runId,
        attempt: params.attempt,
        dataHash: params.dataHash,
        iteration: countCheckpointIterations(checkpoint),
        start: checkpoint.start + 1,
        state: encodeCheckpoint(checkpoint, params.draws),
      });
    },
  };
}

/** A claim after the first (the worker before was lost): the checkpoint to go on from, logged. */
export async function resumeRun(
  deps: AppDeps,
  params: { runId: string; attempt: number; dataHash: string; draws: unknown },
): Promise<ResumePoint | null> {
  const { runId, attempt, dataHash, draws } = params;
  // Only the mixed logit keeps checkpoints; the other models start again (seeded, so they
  // end with the same estimates).
  const resume = draws
    ? await retryWhileDatabaseUnavailable(() => loadResumePoint(deps, { runId, dataHash, draws }))
    : null;
  deps.logger.warn(
    { runId, attempt },
    resume
      ? `resumed from iteration ${resume.iteration} after a worker restart`
      : 'started again from the beginning after a worker restart',
  );
  return resume;
}
