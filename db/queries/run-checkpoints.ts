/**
 * The last checkpoint of a running estimation (one row per run). Like the other worker queries
 * in runs.ts they take the run id from the job queue, which only the server writes, so they
 * need no team. A checkpoint is written only by the claim that holds the run: while the run is
 * running under that attempt (a worker presumed dead and superseded writes nothing).
 * Tenant: none (the run id from the job queue, as above).
 */
import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { runCheckpoints, runs } from '../schema/models';

export type RunCheckpointRow = typeof runCheckpoints.$inferSelect;

/** Saves (replaces) the run's checkpoint; false when `attempt` no longer holds the run. */
export async function saveRunCheckpoint(
  db: DbOrTx,
  params: {
    runId: string;
    attempt: number;
    dataHash: string;
    iteration: number;
    start: number;
    state: unknown;
  },
): Promise<boolean> {
  return db.transaction(async (tx) => {
    // The row lock orders this write after (or before) a sweep that takes the run back.
    const [held] = await tx
      .select({ id: runs.id })
      .from(runs)
      .where(
        and(
          eq(runs.id, params.runId),
          eq(runs.status, 'running'),
          eq(runs.attempts, params.attempt),
        ),
      )
      .for('update');
    if (!held) return false;
    const values = { ...params, savedAt: new Date() };
    await tx
      .insert(runCheckpoints)
      .values(values)
      .onConflictDoUpdate({ target: runCheckpoints.runId, set: values });
    return true;
  });
}

export async function getRunCheckpoint(
  db: DbOrTx,
  params: { runId: string },
): Promise<RunCheckpointRow | null> {
  const [row] = await db
    .select({
      runId: runCheckpoints.runId,
      attempt: runCheckpoints.attempt,
      dataHash: runCheckpoints.dataHash,
      iteration: runCheckpoints.iteration,
      start: runCheckpoints.start,
      state: runCheckpoints.state,
      savedAt: runCheckpoints.savedAt,
    })
    .from(runCheckpoints)
    .where(eq(runCheckpoints.runId, params.runId));
  return row ?? null;
}

export async function deleteRunCheckpoint(db: DbOrTx, params: { runId: string }): Promise<void> {
  await db.delete(runCheckpoints).where(eq(runCheckpoints.runId, params.runId));
}
