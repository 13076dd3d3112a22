/**
 * Design-generation jobs: one row per request, updated by the worker as it goes. Tenant: what a
 * request reaches carries the team; the worker's functions (getDesignJobForWorker, claim,
 * progress, finish, isDesignJobCancelRequested) take the job id from the job queue, which only the
 * server writes, and the sweeps (failStale, listQueued, failQueued) cover every team on purpose.
 */
import { and, desc, eq, inArray, isNull, lt, sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { failQueuedRows, listQueuedRows } from './queued-rows';
import { designJobs } from '../schema/studies';

export const designJobColumns = {
  id: designJobs.id,
  studyId: designJobs.studyId,
  teamId: designJobs.teamId,
  spec: designJobs.spec,
  purpose: designJobs.purpose,
  status: designJobs.status,
  progress: designJobs.progress,
  designId: designJobs.designId,
  error: designJobs.error,
  cancelRequested: designJobs.cancelRequested,
  createdBy: designJobs.createdBy,
  createdAt: designJobs.createdAt,
  startedAt: designJobs.startedAt,
  finishedAt: designJobs.finishedAt,
};

export async function insertDesignJob(
  db: DbOrTx,
  params: {
    studyId: string;
    teamId: string;
    spec: unknown;
    purpose?: 'attach' | 'candidate';
    createdBy: string | null;
  },
) {
  const [row] = await db.insert(designJobs).values(params).returning(designJobColumns);
  return row;
}

export async function getDesignJob(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select(designJobColumns)
    .from(designJobs)
    .where(and(eq(designJobs.id, params.id), eq(designJobs.teamId, params.teamId)));
  return row ?? null;
}

/** For the worker, which is given only the job id by the queue. */
export async function getDesignJobForWorker(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .select(designJobColumns)
    .from(designJobs)
    .where(eq(designJobs.id, params.id));
  return row ?? null;
}

/** The study's newest design job, of those `only` admits (all when it is undefined). */
async function getNewestStudyDesignJob(
  db: DbOrTx,
  params: { studyId: string; teamId: string },
  only?: SQL,
) {
  const [row] = await db
    .select(designJobColumns)
    .from(designJobs)
    .where(and(eq(designJobs.studyId, params.studyId), eq(designJobs.teamId, params.teamId), only))
    .orderBy(desc(designJobs.createdAt))
    .limit(1);
  return row ?? null;
}

export async function getLatestDesignJob(db: DbOrTx, params: { studyId: string; teamId: string }) {
  return getNewestStudyDesignJob(db, params);
}

export async function getActiveDesignJob(db: DbOrTx, params: { studyId: string; teamId: string }) {
  return getNewestStudyDesignJob(db, params, inArray(designJobs.status, ['queued', 'running']));
}

/** queued → running; returns null when the job was already taken or cancelled. */
export async function claimDesignJob(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .update(designJobs)
    .set({
      status: 'running',
      startedAt: new Date(),
      progress: { phase: 'building', fraction: 0, at: new Date().toISOString() },
    })
    .where(
      and(
        eq(designJobs.id, params.id),
        eq(designJobs.status, 'queued'),
        isNull(designJobs.cancelRequested),
      ),
    )
    .returning(designJobColumns);
  return row ?? null;
}

export async function setDesignJobProgress(db: DbOrTx, params: { id: string; progress: unknown }) {
  const [row] = await db
    .update(designJobs)
    .set({ progress: params.progress })
    .where(and(eq(designJobs.id, params.id), eq(designJobs.status, 'running')))
    .returning({ cancelRequested: designJobs.cancelRequested });
  return row ?? null;
}

export async function finishDesignJob(
  db: DbOrTx,
  params: {
    id: string;
    status: 'done' | 'failed' | 'cancelled';
    designId?: string | null;
    error?: string | null;
    progress?: unknown;
  },
) {
  const [row] = await db
    .update(designJobs)
    .set({
      status: params.status,
      designId: params.designId ?? null,
      error: params.error ?? null,
      finishedAt: new Date(),
      ...(params.progress !== undefined ? { progress: params.progress } : {}),
    })
    .where(and(eq(designJobs.id, params.id), inArray(designJobs.status, ['queued', 'running'])))
    .returning(designJobColumns);
  return row ?? null;
}

/** Cancel: a queued job ends at once; a running one is told to stop. */
export async function requestDesignJobCancel(db: DbOrTx, params: { id: string; teamId: string }) {
  const now = new Date();
  const [row] = await db
    .update(designJobs)
    .set({
      cancelRequested: now,
      status: sql`case when ${designJobs.status} = 'queued' then 'cancelled'::job_status else ${designJobs.status} end`,
      finishedAt: sql`case when ${designJobs.status} = 'queued' then ${now.toISOString()}::timestamptz else ${designJobs.finishedAt} end`,
    })
    .where(
      and(
        eq(designJobs.id, params.id),
        eq(designJobs.teamId, params.teamId),
        inArray(designJobs.status, ['queued', 'running']),
      ),
    )
    .returning(designJobColumns);
  return row ?? null;
}

export async function isDesignJobCancelRequested(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .select({ c: designJobs.cancelRequested })
    .from(designJobs)
    .where(eq(designJobs.id, params.id));
  return row?.c != null;
}

/** Jobs whose worker stopped reporting (crash, kill): they end as failed, never stuck. */
export async function failStaleDesignJobs(db: DbOrTx, params: { silentSince: Date }) {
  return db
    .update(designJobs)
    .set({
      status: 'failed',
      error: 'The design worker stopped unexpectedly. Start the generation again.',
      finishedAt: new Date(),
    })
    .where(
      and(
        eq(designJobs.status, 'running'),
        lt(
          sql`coalesce((${designJobs.progress}->>'at')::timestamptz, ${designJobs.startedAt})`,
          params.silentSince,
        ),
      ),
    )
    .returning({ id: designJobs.id });
}

/** Design jobs still queued that were created before `createdBefore` (orphan-sweep.ts). */
export function listQueuedDesignJobs(db: DbOrTx, createdBefore: Date) {
  return listQueuedRows(db, designJobs, createdBefore);
}

/** Fails these design jobs if they are still queued; returns the ids it failed. */
export function failQueuedDesignJobs(db: DbOrTx, ids: string[], error: string) {
  return failQueuedRows(db, designJobs, ids, { status: 'failed', error, finishedAt: new Date() });
}

/** The study's latest candidate job (services/redesign.ts): its design, if any, waits to be adopted. */
export async function getLatestCandidateJob(
  db: DbOrTx,
  params: { studyId: string; teamId: string },
) {
  return getNewestStudyDesignJob(db, params, eq(designJobs.purpose, 'candidate'));
}
