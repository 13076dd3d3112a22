/**
 * Jobs that never hang. A design or estimation row waits as 'queued' until a worker takes its
 * pg-boss message; if that message is gone (deleted, expired, lost with a restored database or
 * a queue restarted without it), the row would wait for ever. Every minute, workers look for
 * queued rows older than ORPHAN_AFTER_MS that no waiting or running job names: one younger than
 * REQUEUE_WITHIN_MS is queued again (its handler claims it atomically, so a duplicate message
 * does nothing); an older one is failed with a reason the user can act on.
 */
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';

/** A queued row gets this long for its message to be taken before it counts as orphaned. */
export const ORPHAN_AFTER_MS = 2 * 60_000;
/** Orphans younger than this are queued again; older ones are failed. */
export const REQUEUE_WITHIN_MS = 60 * 60_000;

export type SendOptions = {
  /** Enqueue inside this transaction: the job exists exactly when the caller's rows do. */
  tx?: DbOrTx;
  /** Not before this many seconds from now. */
  startAfterSeconds?: number;
};

/** What a sweep needs of the queue: the ids its live jobs carry, and sending. */
export interface SweepQueue {
  /** Values of `data[idField]` of this kind's jobs that are waiting, retrying or running. */
  pendingIds(name: string, idField: string): Promise<Set<string>>;
  send(name: string, data: object, opts?: SendOptions): Promise<void>;
}

export type OrphanSpec = {
  jobName: string;
  /** The field of the job data that holds the row id (e.g. runId). */
  idField: string;
  /** Rows still queued that were created before `createdBefore`. */
  listQueued(db: DbOrTx, createdBefore: Date): Promise<Array<{ id: string; createdAt: Date }>>;
  /** Fails the rows that are still queued; returns those it failed. */
  failQueued(db: DbOrTx, ids: string[], reason: string): Promise<string[]>;
  reason: string;
  /** Orphans younger than this are queued again; older ones failed (default REQUEUE_WITHIN_MS). */
  requeueWithinMs?: number;
};

export async function sweepOrphans(
  deps: AppDeps,
  queue: SweepQueue,
  spec: OrphanSpec,
  now = new Date(),
): Promise<{ requeued: string[]; failed: string[] }> {
  const queued = await spec.listQueued(deps.db, new Date(now.getTime() - ORPHAN_AFTER_MS));
  if (queued.length === 0) return { requeued: [], failed: [] };
  const pending = await queue.pendingIds(spec.jobName, spec.idField);
  const orphans = queued.filter((r) => !pending.has(r.id));
  const cutoff = now.getTime() - (spec.requeueWithinMs ?? REQUEUE_WITHIN_MS);
  const requeued: string[] = [];
  for (const r of orphans.filter((o) => o.createdAt.getTime() >= cutoff)) {
    await queue.send(spec.jobName, { [spec.idField]: r.id });
    requeued.push(r.id);
  }
  const tooOld = orphans.filter((o) => o.createdAt.getTime() < cutoff).map((o) => o.id);
  const failed = tooOld.length > 0 ? await spec.failQueued(deps.db, tooOld, spec.reason) : [];
  if (requeued.length > 0)
    deps.logger.warn({ ids: requeued, job: spec.jobName }, 'queued again: queue message missing');
  if (failed.length > 0)
    deps.logger.warn({ ids: failed, job: spec.jobName }, 'failed: queue message missing');
  return { requeued, failed };
}
