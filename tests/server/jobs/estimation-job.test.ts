/**
 * A run end to end in-process: the API enqueues, the job handler (what the worker runs) claims
 * the run, estimates, stores results and one taste profile per respondent; cancel stops a
 * running run; a run left running by a dead worker is queued again by the sweep and started
 * again (an MNL keeps no checkpoint), or failed once it has lost its worker too often. Runs
 * say how they read their respondents (docs/methods.md "Run data order"): a new run by
 * respondent number; a run stored before the order was, by id, also when computed again, so it
 * reproduces bit for bit.
 */
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { useEstimationPool } from '../../support/engine-pools';
import { runs } from '../../../db/schema/models';
import { respondents } from '../../../db/schema/fieldwork';
import { listRunProfiles } from '../../../db/queries/taste-profiles';
import { getRunForJob } from '../../../db/queries/runs';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import {
  MAX_RUN_ATTEMPTS,
  STALE_RUN_MS,
  sweepStaleRuns,
  WORKER_LOST_ERROR,
} from '../../../server/jobs/stale-run-sweep';
import {
  hashChoiceData,
  loadStudyChoiceData,
} from '../../../server/services/choice-data-from-study';
import { mixedLogitSpec, TRUE_MNL, useRunStudy } from './run-fixtures';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });
const pool = useEstimationPool();

const allColumns = Object.keys(TRUE_MNL).map((key, k) => ({ name: `b${k}`, column: key }));

const study = useRunStudy(t, 80);

describe('estimation job', () => {
  it('runs an MNL to done with results, fit statistics, WTP and the data hash', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'mnl', coefficients: allColumns, cost: 'b0' } })
      .expect(201);
    await runEstimationJob(t.deps, t.sent[0].data.runId!, { threads: 1, pool });
    const run = (await t.team.agents.viewer.get(`${study.base}/${res.body.id}`).expect(200)).body;
    expect(run.status).toBe('done');
    expect(run.error).toBeNull();
    expect(run.dataHash).toMatch(/^[0-9a-f]{64}$/);
    expect(run.results).toMatchObject({
      model: 'mnl',
      respondents: 80,
      observations: 640,
      parameters: 9,
      converged: true,
      individuals: null,
      data: { respondents: 80, tasks: 640, holdoutTasks: 80, warmupTasksLeftOut: 80 },
    });
    expect(run.results.holdoutHitRate).toBeGreaterThan(0);
    expect(run.results.columns[0]).toEqual({
      key: 'attr:bill',
      coefficient: 'b0',
      label: 'Monthly bill increase (€)',
      // The cost coefficient is the denominator of every WTP: no WTP unit of its own.
      wtpUnit: null,
    });
    expect(run.results.columns[1].wtpUnit).toMatch(/^€ of monthly bill increase /);
    expect(run.results.wtp).toHaveLength(8);
    // Recovery within two standard errors (common practice, no source).
    Object.values(TRUE_MNL).forEach((truth, k) => {
      const e = run.results.estimates[k];
      expect(Math.abs(e.estimate - truth)).toBeLessThan(2 * e.se + 1e-9);
    });
    expect(run.progress.elapsedMs).toBeGreaterThanOrEqual(0);
  });

  it('runs a mixed logit with a negative lognormal cost and stores a profile per respondent', async () => {
    const res = await t.team.agents.owner
      .post(study.base)
      .send({
        spec: {
          model: 'mixed',
          coefficients: [
            { name: 'bill', column: 'attr:bill', distribution: 'neg_lognormal' },
            { name: 'river_good', column: 'attr:river:good', distribution: 'normal' },
            { name: 'interrupt', column: 'attr:interrupt' },
            { name: 'sq', column: 'asc:fixed' },
          ],
          draws: { count: 50, seed: 4 },
          profileDraws: 200,
          cost: 'bill',
        },
      })
      .expect(201);
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const run = (await t.team.agents.viewer.get(`${study.base}/${res.body.id}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    expect(run.seed).toBe(4);
    expect(run.progress.iteration).toBeGreaterThan(0);
    expect(run.results.estimates.map((e: { name: string }) => e.name)).toEqual([
      'bill.mean',
      'river_good.mean',
      'interrupt',
      'sq',
      'bill.sd',
      'river_good.sd',
    ]);
    const profiles = await listRunProfiles(t.deps.db, {
      runId: res.body.id,
      studyId: study.studyId,
    });
    expect(profiles.map((p) => p.respondentId).sort()).toEqual(study.respondentIds);
    expect(Object.keys(profiles[0].mean as object).sort()).toEqual([
      'bill',
      'interrupt',
      'river_good',
      'sq',
    ]);
    expect(profiles[0].wtp).toHaveProperty('river_good');
    const means = await t.team.agents.viewer
      .get(`${study.base}/${res.body.id}/conditional-means`)
      .expect(200);
    expect(means.body.coefficients).toEqual(['bill', 'river_good', 'interrupt', 'sq']);
    expect(means.body.values[0]).toHaveLength(80);
    expect(means.body.values[0].every((v: number) => v < 0)).toBe(true);
  });

  it('fails with a readable reason when the data cannot be used', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'mnl', coefficients: allColumns } })
      .expect(201);
    // The study's only version disappears before a worker picks the run up.
    await t.deps.db
      .update(runs)
      .set({ studyId: (await seedEmptyStudy()).id })
      .where(eq(runs.id, res.body.id));
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const row = await getRunForJob(t.deps.db, { id: res.body.id });
    expect(row?.status).toBe('failed');
    expect(row?.error).toBe('The study has not been live yet, so it has no answers.');
  });

  it('stops a running run when it is cancelled, and leaves it cancelled', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({
        spec: {
          model: 'mixed',
          coefficients: allColumns.map((c) => ({ ...c, distribution: 'normal' })),
          draws: { count: 1000, seed: 2 },
        },
      })
      .expect(201);
    // Two threads: the log-likelihood runs off this thread, so the API answers meanwhile.
    const job = runEstimationJob(t.deps, res.body.id, { threads: 2, pool });
    // Wait until the worker has claimed the run, then cancel through the API.
    for (let i = 0; i < 200; i++) {
      const row = await getRunForJob(t.deps.db, { id: res.body.id });
      if (row?.status === 'running') break;
      await new Promise((r) => setTimeout(r, 20));
    }
    const cancel = await t.team.agents.analyst
      .post(`${study.base}/${res.body.id}/cancel`)
      .expect(200);
    expect(cancel.body).toMatchObject({ status: 'running', cancelRequested: true });
    await job;
    const row = await getRunForJob(t.deps.db, { id: res.body.id });
    expect(row?.status).toBe('cancelled');
    expect(
      await listRunProfiles(t.deps.db, { runId: res.body.id, studyId: study.studyId }),
    ).toEqual([]);
  });

  it('does not start a run cancelled while queued', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'mnl', coefficients: allColumns } })
      .expect(201);
    await t.team.agents.analyst.post(`${study.base}/${res.body.id}/cancel`).expect(200);
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const row = await getRunForJob(t.deps.db, { id: res.body.id });
    expect(row?.status).toBe('cancelled');
    expect(row?.startedAt).toBeNull();
  });
});

describe('stale-run sweep (worker crash)', () => {
  it('queues again runs left by a dead worker, fails those that lost it too often, leaves live ones', async () => {
    const make = async () =>
      (
        await t.team.agents.analyst
          .post(study.base)
          .send({ spec: { model: 'mnl', coefficients: allColumns } })
          .expect(201)
      ).body.id as string;
    const dead = await make();
    const deadTooOften = await make();
    const alive = await make();
    const silent = new Date(Date.now() - STALE_RUN_MS - 60_000);
    // A worker claimed `dead`, then crashed: its heartbeat stopped long ago.
    const claimed = (attempts: number, at: Date) => ({
      status: 'running' as const,
      attempts,
      startedAt: at,
      progress: { heartbeatAt: at.toISOString() },
    });
    await t.deps.db.update(runs).set(claimed(1, silent)).where(eq(runs.id, dead));
    await t.deps.db
      .update(runs)
      .set(claimed(MAX_RUN_ATTEMPTS, silent))
      .where(eq(runs.id, deadTooOften));
    await t.deps.db.update(runs).set(claimed(1, new Date())).where(eq(runs.id, alive));
    const swept = await sweepStaleRuns(t.deps);
    expect(swept.resumed).toContain(dead);
    expect(swept.failed).toContain(deadTooOften);
    expect([...swept.resumed, ...swept.failed]).not.toContain(alive);
    expect(t.sent.filter((s) => s.data.runId === dead)).toHaveLength(2); // created, then queued again
    expect(await getRunForJob(t.deps.db, { id: dead })).toMatchObject({ status: 'queued' });
    const failedRow = await getRunForJob(t.deps.db, { id: deadTooOften });
    expect(failedRow).toMatchObject({ status: 'failed', error: WORKER_LOST_ERROR });
    expect(WORKER_LOST_ERROR).toMatch(/stopped unexpectedly 3 times/);
    expect((await getRunForJob(t.deps.db, { id: alive }))?.status).toBe('running');
    const waiting = (await t.team.agents.viewer.get(`${study.base}/${dead}`).expect(200)).body;
    expect(waiting).toMatchObject({ status: 'queued', attempts: 1 });

    // The next worker takes it: an MNL keeps no checkpoint, so it starts from the beginning.
    await runEstimationJob(t.deps, dead, { threads: 1, pool });
    const view = (await t.team.agents.viewer.get(`${study.base}/${dead}`).expect(200)).body;
    expect(view).toMatchObject({ status: 'done', attempts: 2, error: null });
    expect(view.progress.resumed).toEqual({ attempt: 2, fromIteration: 0 });
  });

  it('without a queue to send to, leaves a resumable run alone', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'mnl', coefficients: allColumns } })
      .expect(201);
    const silent = new Date(Date.now() - STALE_RUN_MS - 60_000);
    await t.deps.db
      .update(runs)
      .set({ status: 'running', attempts: 1, progress: { heartbeatAt: silent.toISOString() } })
      .where(eq(runs.id, res.body.id));
    const swept = await sweepStaleRuns(t.deps, Date.now(), null);
    expect(swept).toEqual({ resumed: [], failed: [] });
    expect((await getRunForJob(t.deps.db, { id: res.body.id }))?.status).toBe('running');
    await t.deps.db.update(runs).set({ status: 'cancelled' }).where(eq(runs.id, res.body.id));
  });
});

async function seedEmptyStudy() {
  const { studies } = await import('../../../db/schema/studies');
  const [row] = await t.deps.db
    .insert(studies)
    .values({ teamId: t.team.teamId, publicId: `e${Date.now()}`, name: 'Empty', definition: {} })
    .returning({ id: studies.id });
  return row;
}

const getRun = async (id: string) =>
  (await t.team.agents.viewer.get(`${study.base}/${id}`).expect(200)).body;
const keys = mixedLogitSpec(20, 9).coefficients.map((c) => c.column);

describe('run data order', () => {
  it('reads a new run in respondent-number order and says so', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: mixedLogitSpec(20, 9) })
      .expect(201);
    expect(res.body.dataOrder).toBe('respondent-number');
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const run = await getRun(res.body.id);
    expect(run.status).toBe('done');
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId: study.studyId });
    expect(run.dataHash).toBe(hashChoiceData(prepared, keys));
  }, 120_000);

  it('computes a run stored without a data order again in id order, bit for bit', async () => {
    // The fixture's ids follow the order of starting; the first respondent starting last makes
    // id order and respondent-number order differ.
    await t.deps.db
      .update(respondents)
      .set({ startedAt: new Date(Date.now() + 3_600_000) })
      .where(eq(respondents.id, study.respondentIds[0]));
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: mixedLogitSpec(20, 9) })
      .expect(201);
    // As a run stored before the data order was: its stored spec has no dataOrder.
    await t.deps.db
      .update(runs)
      .set({ spec: sql`${runs.spec} - 'dataOrder'` })
      .where(eq(runs.id, res.body.id));
    expect((await getRun(res.body.id)).dataOrder).toBe('respondent-id');
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const first = await getRun(res.body.id);
    expect(first.status).toBe('done');
    const byId = await loadStudyChoiceData(t.deps.db, {
      studyId: study.studyId,
      order: 'respondent-id',
    });
    expect(first.dataHash).toBe(hashChoiceData(byId, keys));
    const byNumber = await loadStudyChoiceData(t.deps.db, { studyId: study.studyId });
    expect(first.dataHash).not.toBe(hashChoiceData(byNumber, keys));

    // Computed again: the same data, the same estimates to the last bit.
    await t.deps.db
      .update(runs)
      .set({ status: 'queued', results: null, dataHash: null })
      .where(eq(runs.id, res.body.id));
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    const again = await getRun(res.body.id);
    expect(again.status).toBe('done');
    expect(again.dataHash).toBe(first.dataHash);
    expect(again.results.estimates).toEqual(first.results.estimates);
    expect(again.results.loglik).toBe(first.results.loglik);
  }, 120_000);
});
