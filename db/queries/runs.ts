/**
 * Estimation runs. Tenant: the team and the study are in every where-clause a request reaches;
 * the worker's functions (getRunForJob, claimRun, progress, finish, sweeps) take the run id from
 * the job queue, which only the server writes, so they need no team.
 */
import { and, desc, eq, gte, inArray, isNull, lt, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { failQueuedRows, listQueuedRows } from './queued-rows';
import { runs } from '../schema/models';

export const runColumns = {
  id: runs.id,
  studyId: runs.studyId,
  teamId: runs.teamId,
  name: runs.name,
  model: runs.model,
  spec: runs.spec,
  dataHash: runs.dataHash,
  seed: runs.seed,
  status: runs.status,
  progress: runs.progress,
  results: runs.results,
  error: runs.error,
  attempts: runs.attempts,
  cancelRequested: runs.cancelRequested,
  erasedRespondents: runs.erasedRespondents,
  createdBy: runs.createdBy,
  createdAt: runs.createdAt,
  startedAt: runs.startedAt,
  finishedAt: runs.finishedAt,
};
export type RunRow = Awaited<ReturnType<typeof getRunById>> & {};

export async function insertRun(
  db: DbOrTx,
  params: {
    studyId: string;
    teamId: string;
    name: string;
    model: string;
    spec: unknown;
    seed: number | null;
    createdBy: string | null;
  },
) {
  const [row] = await db.insert(runs).values(params).returning(runColumns);
  return row;
}

export async function getRunById(
  db: DbOrTx,
  params: { id: string; teamId: string; studyId: string },
) {
  const [row] = await db
    .select(runColumns)
    .from(runs)
    .where(
      and(eq(runs.id, params.id), eq(runs.teamId, params.teamId), eq(runs.studyId, params.studyId)),
    );
  return row ?? null;
}

export async function listRuns(db: DbOrTx, params: { teamId: string; studyId: string }) {
  return db
    .select(runColumns)
    .from(runs)
    .where(and(eq(runs.teamId, params.teamId), eq(runs.studyId, params.studyId)))
    .orderBy(desc(runs.createdAt));
}

/** Finished runs of a study, newest first, with how many taste profiles each stored. */
export async function listFinishedRuns(db: DbOrTx, params: { teamId: string; studyId: string }) {
  const profiles = sql<number>`(select count(*)::int from taste_profiles tp where tp.run_id = ${runs.id})`;
  return db
    .select({ ...runColumns, profiles: profiles.mapWith(Number) })
    .from(runs)
    .where(
      and(
        eq(runs.teamId, params.teamId),
        eq(runs.studyId, params.studyId),
        eq(runs.status, 'done'),
      ),
    )
    .orderBy(desc(runs.finishedAt), desc(runs.createdAt));
}

export async function countRuns(db: DbOrTx, params: { teamId: string; studyId: string }) {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(runs)
    .where(and(eq(runs.teamId, params.teamId), eq(runs.studyId, params.studyId)));
  return Number(row?.n ?? 0);
}

/** For the worker, which knows only the run id from the job. */
export async function getRunForJob(db: DbOrTx, params: { id: string }) {
  const [row] = await db.select(runColumns).from(runs).where(eq(runs.id, params.id));
  return row ?? null;
}

/** Claims a queued (or, after a crash, running) run for a worker; null if it is not claimable. */
export async function claimRun(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .update(runs)
    .set({
      status: 'running',
      attempts: sql`${runs.attempts} + 1`,
      startedAt: new Date(),
      error: null,
      progress: { stage: 'preparing', heartbeatAt: new Date().toISOString() },
    })
    .where(
      and(
        eq(runs.id, params.id),
        inArray(runs.status, ['queued', 'running']),
        isNull(runs.cancelRequested),
      ),
    )
    .returning(runColumns);
  return row ?? null;
}

/** The claim `attempt` still holds the run (it was not taken back by the stale-run sweep). */
const heldBy = (attempt: number | undefined) =>
  attempt === undefined ? [] : [eq(runs.status, 'running'), eq(runs.attempts, attempt)];

/** Writes a running run's progress; with `attempt`, only while that claim holds it. */
export async function updateRunProgress(
  db: DbOrTx,
  params: { id: string; progress: unknown; attempt?: number },
) {
  await db
    .update(runs)
    .set({ progress: params.progress })
    .where(and(eq(runs.id, params.id), eq(runs.status, 'running'), ...heldBy(params.attempt)));
}

export async function setRunDataHash(
  db: DbOrTx,
  params: { id: string; dataHash: string; seed: number | null },
) {
  await db
    .update(runs)
    .set({ dataHash: params.dataHash, seed: params.seed })
    .where(eq(runs.id, params.id));
}

/**
 * Ends a run that is still queued or running; returns null when it had already ended. With
 * `attempt`, only a run that claim still holds (a superseded worker ends nothing).
 */
export async function finishRun(
  db: DbOrTx,
  params: {
    id: string;
    status: 'done' | 'failed' | 'cancelled' | 'queued';
    results?: unknown;
    error?: string | null;
    progress?: unknown;
    attempt?: number;
  },
) {
  const [row] = await db
    .update(runs)
    .set({
      status: params.status,
      ...(params.results !== undefined ? { results: params.results } : {}),
      ...(params.progress !== undefined ? { progress: params.progress } : {}),
      error: params.error ?? null,
      finishedAt: params.status === 'queued' ? null : new Date(),
    })
    .where(
      and(
        eq(runs.id, params.id),
        inArray(runs.status, ['queued', 'running']),
        ...heldBy(params.attempt),
      ),
    )
    .returning(runColumns);
  return row ?? null;
}

/** Marks a cancel request; a queued run is cancelled at once, a running one by its worker. */
export async function requestRunCancel(
  db: DbOrTx,
  params: { id: string; teamId: string; studyId: string },
) {
  const scope = and(
    eq(runs.id, params.id),
    eq(runs.teamId, params.teamId),
    eq(runs.studyId, params.studyId),
  );
  const [queued] = await db
    .update(runs)
    .set({ status: 'cancelled', cancelRequested: new Date(), finishedAt: new Date() })
    .where(and(scope, eq(runs.status, 'queued')))
    .returning(runColumns);
  if (queued) return queued;
  const [running] = await db
    .update(runs)
    .set({ cancelRequested: new Date() })
    .where(and(scope, eq(runs.status, 'running')))
    .returning(runColumns);
  return running ?? null;
}

const silentSince = (since: Date) =>
  lt(
    sql`coalesce((${runs.progress}->>'heartbeatAt')::timestamptz, ${runs.startedAt}, ${runs.createdAt})`,
    since,
  );

/**
 * Fails running runs whose worker has been silent since `silentSince` (crash, restart) and
 * that have been claimed at least `minAttempts` times.
 */
export async function failStaleRuns(
  db: DbOrTx,
  params: { silentSince: Date; error: string; minAttempts?: number },
) {
  return db
    .update(runs)
    .set({ status: 'failed', error: params.error, finishedAt: new Date() })
    .where(
      and(
        eq(runs.status, 'running'),
        silentSince(params.silentSince),
        gte(runs.attempts, params.minAttempts ?? 0),
      ),
    )
    .returning({ id: runs.id });
}

/**
 * Puts running runs whose worker has been silent since `silentSince` and that have been claimed
 * fewer than `maxAttempts` times back in the queue (the caller sends their jobs in the same
 * transaction); returns their ids.
 */
export async function requeueStaleRuns(
  db: DbOrTx,
  params: { silentSince: Date; maxAttempts: number },
) {
  return db
    .update(runs)
    .set({ status: 'queued' })
    .where(
      and(
        eq(runs.status, 'running'),
        silentSince(params.silentSince),
        lt(runs.attempts, params.maxAttempts),
      ),
    )
    .returning({ id: runs.id, attempts: runs.attempts });
}

/** Runs still queued that were created before `createdBefore` (orphan-sweep.ts). */
export function listQueuedRuns(db: DbOrTx, createdBefore: Date) {
  return listQueuedRows(db, runs, createdBefore);
}

/** Fails these runs if they are still queued; returns the ids it failed. */
export function failQueuedRuns(db: DbOrTx, ids: string[], error: string) {
  return failQueuedRows(db, runs, ids, { status: 'failed', error, finishedAt: new Date() });
}
