/**
 * A mixed logit whose worker is lost after a checkpoint goes on from it. In-process: the job
 * handler estimates with a checkpoint after every iteration; once one is saved, the worker is
 * taken for dead (the sweep's clock moved past STALE_RUN_MS), the sweep queues the run again,
 * and the first handler, which would still be writing were it a worker only presumed dead,
 * notices it no longer holds the run and stops without writing. A second handler then takes
 * the run: it says it resumed from the checkpoint's iteration and ends done with the estimates
 * of an uninterrupted run of the same specification. Same data, draws, seed and thread count,
 * so the two paths are the same floating-point operations: the estimates must be equal.
 * (tests/server/faults/worker-death.test.ts does the same with a real worker killed by SIGKILL.)
 */
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { useEstimationPool } from '../../support/engine-pools';
import { waitFor } from '../../support/wait-for';
import { getRunForJob } from '../../../db/queries/runs';
import { getRunCheckpoint, saveRunCheckpoint } from '../../../db/queries/run-checkpoints';
import { runs } from '../../../db/schema/models';
import { eq } from 'drizzle-orm';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import { STALE_RUN_MS, sweepStaleRuns } from '../../../server/jobs/stale-run-sweep';
import { mixedLogitSpec, useRunStudy } from './run-fixtures';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });
const pool = useEstimationPool();

const study = useRunStudy(t, 80, 60_000);

async function startRun(): Promise<string> {
  // Three starts (the default) and enough draws that the run is still estimating when the
  // worker is taken for dead: with 500 draws the run takes 41 iterations over its three starts
  // and is swept right after its third (measured: 0.7 s into a 5 s run at a load average of 20).
  const res = await t.team.agents.analyst
    .post(study.base)
    .send({ spec: mixedLogitSpec(500, 13, true) })
    .expect(201);
  return res.body.id;
}

describe('a mixed logit whose worker is lost after a checkpoint', () => {
  it('is queued again, resumes from the checkpoint and ends with the uninterrupted estimates', async () => {
    const reference = await startRun();
    await runEstimationJob(t.deps, reference, { threads: 1, pool });
    const whole = await getRunForJob(t.deps.db, { id: reference });
    expect(whole).toMatchObject({ status: 'done', attempts: 1 });
    expect(await getRunCheckpoint(t.deps.db, { runId: reference })).toBeNull();

    const id = await startRun();
    const first = runEstimationJob(t.deps, id, { threads: 1, checkpointEveryMs: 0, pool });
    await waitFor(
      async () => {
        const saved = await getRunCheckpoint(t.deps.db, { runId: id });
        return saved && saved.iteration >= 3 ? saved : null;
      },
      120_000,
      { everyMs: 25 },
    );
    const swept = await sweepStaleRuns(t.deps, Date.now() + STALE_RUN_MS + 1_000);
    expect(swept).toEqual({ resumed: [id], failed: [] });
    expect(t.sent.filter((s) => s.data.runId === id)).toHaveLength(2); // created, then queued again
    await first; // it noticed that it lost the run, and stopped
    const between = await getRunForJob(t.deps.db, { id });
    expect(between).toMatchObject({ status: 'queued', attempts: 1, results: null });
    const checkpoint = await getRunCheckpoint(t.deps.db, { runId: id });
    expect(checkpoint).toMatchObject({ attempt: 1 });
    expect(checkpoint!.iteration).toBeGreaterThanOrEqual(3);

    await runEstimationJob(t.deps, id, { threads: 1, pool });
    const resumed = await getRunForJob(t.deps.db, { id });
    expect(resumed).toMatchObject({ status: 'done', attempts: 2, error: null });
    const view = (await t.team.agents.viewer.get(`${study.base}/${id}`).expect(200)).body;
    expect(view.progress.resumed).toEqual({ attempt: 2, fromIteration: checkpoint!.iteration });
    type Stored = { estimates: unknown[]; loglik: number; iterations: number; wtp: unknown };
    const a = whole!.results as Stored;
    const b = resumed!.results as Stored;
    // Every estimate with its SE, t and interval; the LL, iterations and WTP.
    expect(b.estimates).toEqual(a.estimates);
    expect(b.loglik).toBe(a.loglik);
    expect(b.iterations).toBe(a.iterations);
    expect(b.wtp).toEqual(a.wtp);
    expect(await getRunCheckpoint(t.deps.db, { runId: id })).toBeNull();
  }, 300_000);

  it('starts again from the beginning when the choice data changed since the checkpoint', async () => {
    const id = await startRun();
    // A worker took it, saved a checkpoint on other data (respondents since added or erased),
    // and was lost; the sweep queued it again.
    await t.deps.db.update(runs).set({ status: 'running', attempts: 1 }).where(eq(runs.id, id));
    expect(
      await saveRunCheckpoint(t.deps.db, {
        runId: id,
        attempt: 1,
        dataHash: 'f'.repeat(64),
        iteration: 7,
        start: 1,
        state: {},
      }),
    ).toBe(true);
    await t.deps.db.update(runs).set({ status: 'queued' }).where(eq(runs.id, id));
    await runEstimationJob(t.deps, id, { threads: 1, pool });
    const view = (await t.team.agents.viewer.get(`${study.base}/${id}`).expect(200)).body;
    expect(view).toMatchObject({ status: 'done', attempts: 2 });
    expect(view.progress.resumed).toEqual({ attempt: 2, fromIteration: 0 });
    expect(await getRunCheckpoint(t.deps.db, { runId: id })).toBeNull();
  }, 300_000);
});
