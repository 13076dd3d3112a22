/**
 * The real queue (pg-boss on the test database) with a worker in this process: a run started
 * through the API is picked up and finished by the worker, and a run left running by a worker
 * that died is queued again by the sweep the worker runs when it starts, and finished.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { waitForRun } from '../../support/wait-for';
import { runs } from '../../../db/schema/models';
import { startJobQueue, type JobQueue } from '../../../server/jobs/queue';
import { createJobKinds } from '../../../server/jobs/background';
import { STALE_RUN_MS } from '../../../server/jobs/stale-run-sweep';
import { TRUE_MNL, useRunStudy } from './run-fixtures';

const t = useTestApp({}, { signIn: 'team' });
let queue: JobQueue;
let staleRunId: string;

const study = useRunStudy(t, 20, 60_000);

beforeAll(async () => {
  // A run a crashed worker left behind: running, its heartbeat long silent.
  t.deps.jobs = { send: async () => {} };
  const res = await t.team.agents.analyst
    .post(study.base)
    .send({ spec: { model: 'mnl', coefficients: [{ name: 'bill', column: 'attr:bill' }] } })
    .expect(201);
  staleRunId = res.body.id;
  const silent = new Date(Date.now() - STALE_RUN_MS - 60_000);
  await t.deps.db
    .update(runs)
    .set({
      status: 'running',
      attempts: 1,
      startedAt: silent,
      progress: { heartbeatAt: silent.toISOString() },
    })
    .where(eq(runs.id, staleRunId));
  queue = await startJobQueue(t.deps, { kinds: createJobKinds(), work: true });
  t.deps.jobs = queue;
}, 60_000);

afterAll(async () => {
  await queue?.stop();
});

const waitForEnd = (runId: string, timeoutMs = 45_000) =>
  waitForRun(
    t.deps.db,
    runId,
    (row) => !['queued', 'running'].includes(row.status),
    timeoutMs,
    250,
  );

describe('estimation runs on the job queue', () => {
  it('queues again, at worker start, a run whose worker died, and finishes it', async () => {
    const row = await waitForEnd(staleRunId);
    expect(row).toMatchObject({ status: 'done', attempts: 2, error: null });
    expect(row.progress).toMatchObject({ resumed: { attempt: 2, fromIteration: 0 } });
  }, 60_000);

  it('runs a queued run on the worker to done', async () => {
    const coefficients = Object.keys(TRUE_MNL).map((column, k) => ({ name: `b${k}`, column }));
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'mnl', coefficients } })
      .expect(201);
    const row = await waitForEnd(res.body.id);
    expect(row.error).toBeNull();
    expect(row.status).toBe('done');
    expect(row.dataHash).toMatch(/^[0-9a-f]{64}$/);
    const view = await t.team.agents.viewer.get(`${study.base}/${res.body.id}`).expect(200);
    expect(view.body.results).toMatchObject({ model: 'mnl', respondents: 20, parameters: 9 });
  }, 60_000);
});
