/**
 * The design-generation job: runs the design engine on a piscina worker thread (off the
 * request path and off the event loop), writes progress with a heartbeat, stops when the
 * user cancels, and always leaves the job row finished (done, failed or cancelled).
 */
import { z } from 'zod';
import type { Piscina } from 'piscina';
import { lazyPool } from './lazy-pool';
import type { AppDeps } from '../deps';
import { defineJobKind } from './queue';
import { createDesignPool, runDesignInWorker } from '../engine/design/run-design-in-worker';
import type { DesignProgress } from '../engine/design/generate-design';
import {
  claimDesignJob,
  failQueuedDesignJobs,
  failStaleDesignJobs,
  finishDesignJob,
  getDesignJobForWorker,
  isDesignJobCancelRequested,
  listQueuedDesignJobs,
  setDesignJobProgress,
} from '../../db/queries/design-jobs';
import { sweepOrphans, type OrphanSpec } from './orphan-sweep';
import { getStudyById } from '../../db/queries/studies';
import { getDesignById, insertCurrentDesign, insertDesign } from '../../db/queries/designs';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import { designFitsDefinition } from '../services/design-fit';

export const DESIGN_JOB = 'design-generation';

const ORPHANED_DESIGN_JOBS: OrphanSpec = {
  jobName: DESIGN_JOB,
  idField: 'designJobId',
  listQueued: listQueuedDesignJobs,
  failQueued: failQueuedDesignJobs,
  reason:
    'The job queue lost this design before a worker could take it. Start the generation again.',
};
export const designJobDataSchema = z.object({ designJobId: z.uuid() });

/** How often the worker reports even when the engine is quiet, and checks for cancel. */
const HEARTBEAT_MS = 1000;
/** A running job silent this long has lost its worker. */
const STALE_MS = 2 * 60_000;

type Progress = Partial<DesignProgress> & { at: string };

/** Runs one design job to its end; used by the queue handler and, in-process, by tests. */
export async function runDesignJob(deps: AppDeps, pool: Piscina, designJobId: string) {
  const job = await claimDesignJob(deps.db, { id: designJobId });
  if (!job) {
    // Cancelled while queued (or already handled): make sure it is not left open.
    const row = await getDesignJobForWorker(deps.db, { id: designJobId });
    if (row && row.status === 'queued')
      await finishDesignJob(deps.db, { id: designJobId, status: 'cancelled' });
    return;
  }
  const study = await getStudyById(deps.db, { id: job.studyId, teamId: job.teamId });
  // A candidate is generated beside the current design, whatever the study's status.
  const candidate = job.purpose === 'candidate';
  if (!study || (!candidate && study.status !== 'draft')) {
    await finishDesignJob(deps.db, {
      id: job.id,
      status: 'failed',
      error: 'The study is no longer a draft.',
    });
    return;
  }
  const definition = studyDefinitionSchema.parse(study.definition);
  const currentDesign =
    candidate && study.currentDesignId
      ? await getDesignById(deps.db, { id: study.currentDesignId, teamId: job.teamId })
      : null;
  const abort = new AbortController();
  let latest: Progress = { phase: 'building', fraction: 0, at: new Date().toISOString() };
  let writing = Promise.resolve();
  const report = () => {
    latest = { ...latest, at: new Date().toISOString() };
    const snapshot = latest;
    // Progress is best effort: a failed write is logged and the next heartbeat tries again.
    writing = writing
      .then(async () => {
        const row = await setDesignJobProgress(deps.db, { id: job.id, progress: snapshot });
        if (row?.cancelRequested) abort.abort();
      })
      .catch((err) => deps.logger.warn({ err, designJobId }, 'design progress not saved'));
  };
  const heartbeat = setInterval(report, HEARTBEAT_MS);
  try {
    const out = await runDesignInWorker(
      pool,
      {
        definition,
        spec: job.spec,
        compareWith: currentDesign?.design,
        fieldworkBusy: deps.fieldworkBusy,
      },
      {
        signal: abort.signal,
        onProgress: (p) => {
          latest = { ...latest, ...p, at: latest.at };
        },
      },
    );
    clearInterval(heartbeat);
    await writing;
    if (!out.ok) {
      await finishDesignJob(deps.db, { id: job.id, status: 'failed', error: out.error.message });
      return;
    }
    if (await isDesignJobCancelRequested(deps.db, { id: job.id })) {
      await finishDesignJob(deps.db, { id: job.id, status: 'cancelled' });
      return;
    }
    await deps.db.transaction(async (tx) => {
      const now = await getStudyById(tx, { id: job.studyId, teamId: job.teamId });
      const current = now ? studyDefinitionSchema.safeParse(now.definition) : null;
      if (
        !now ||
        (!candidate && now.status !== 'draft') ||
        !current?.success ||
        !designFitsDefinition(current.data, out.result.design)
      ) {
        await finishDesignJob(tx, {
          id: job.id,
          status: 'failed',
          error: 'The attributes changed while the design was generated. Generate it again.',
        });
        return;
      }
      // A candidate waits beside the current design until someone adopts it.
      const insert = candidate ? insertDesign : insertCurrentDesign;
      const design = await insert(tx, {
        studyId: job.studyId,
        teamId: job.teamId,
        method: out.result.spec.method,
        spec: out.result.spec,
        design: out.result.design,
        // A candidate keeps its side-by-side comparison with the design it was compared with.
        diagnostics: candidate
          ? {
              ...out.result.diagnostics,
              comparison: out.comparison ?? [],
              comparedWith: currentDesign?.id,
            }
          : out.result.diagnostics,
        createdBy: job.createdBy,
      });
      await finishDesignJob(tx, {
        id: job.id,
        status: 'done',
        designId: design.id,
        progress: { ...latest, phase: 'done', fraction: 1, at: new Date().toISOString() },
      });
    });
  } catch (err) {
    clearInterval(heartbeat);
    await writing.catch(() => undefined);
    if (abort.signal.aborted) {
      await finishDesignJob(deps.db, { id: job.id, status: 'cancelled' });
      return;
    }
    deps.logger.error({ err, designJobId }, 'design job failed');
    await finishDesignJob(deps.db, {
      id: job.id,
      status: 'failed',
      error: 'The design could not be generated because of an internal error.',
    });
  }
}

/** The queue registration; one worker thread (design search is CPU-bound). */
export function createDesignJobKind() {
  const pool = lazyPool();
  return defineJobKind({
    name: DESIGN_JOB,
    schema: designJobDataSchema,
    expireInMinutes: 60,
    handle: async (data, { deps }) => {
      const threads = pool.get(() =>
        createDesignPool({ maxThreads: 1, nice: deps.env.ENGINE_THREAD_NICE }),
      );
      await runDesignJob(deps, threads, data.designJobId);
    },
    sweep: async (deps, queue) => {
      const failed = await failStaleDesignJobs(deps.db, {
        silentSince: new Date(Date.now() - STALE_MS),
      });
      if (failed.length > 0) deps.logger.warn({ ids: failed }, 'failed stale design jobs');
      if (queue) await sweepOrphans(deps, queue, ORPHANED_DESIGN_JOBS);
    },
    close: pool.close,
  });
}
