/**
 * Jobs that never hang, on the real queue (pg-boss on the test database): a run is enqueued in
 * the same transaction as its row (a rolled-back transaction leaves no job; a queue that cannot
 * take the job leaves no row); a queued run whose queue message was lost is queued again by
 * the sweep and runs to done; one that has waited too long is failed with a reason.
 */
import { describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { runs } from '../../../db/schema/models';
import { getRunForJob } from '../../../db/queries/runs';
import { startJobQueue } from '../../../server/jobs/queue';
import { createJobKinds } from '../../../server/jobs/background';
import { ESTIMATION_JOB } from '../../../server/services/runs';
import { TRUE_MNL, useRunStudy } from './run-fixtures';

// A queue that only sends: nothing takes its jobs while the transaction tests look at them.
const t = useTestApp({}, { signIn: 'team', jobQueue: { work: false } });
const spec = {
  model: 'mnl',
  coefficients: Object.keys(TRUE_MNL).map((column, k) => ({ name: `b${k}`, column })),
};

const study = useRunStudy(t, 20, 60_000);

/** Starts a run through the API while the queue loses every message, then ages its row. */
async function runWithLostMessage(minutesAgo: number): Promise<string> {
  t.deps.jobs = { send: async () => {} };
  const res = await t.team.agents.analyst.post(study.base).send({ spec }).expect(201);
  await t.deps.db
    .update(runs)
    .set({ createdAt: new Date(Date.now() - minutesAgo * 60_000) })
    .where(eq(runs.id, res.body.id));
  return res.body.id;
}

describe('a job is enqueued in the same transaction as its row', () => {
  it('a rolled-back transaction leaves no job; a committed one leaves one', async () => {
    const lost = randomUUID();
    await expect(
      t.deps.db.transaction(async (tx) => {
        await t.queue.send(ESTIMATION_JOB, { runId: lost }, { tx });
        throw new Error('the row could not be written');
      }),
    ).rejects.toThrow('the row could not be written');
    expect((await t.queue.pendingIds(ESTIMATION_JOB, 'runId')).has(lost)).toBe(false);

    const kept = randomUUID();
    await t.deps.db.transaction((tx) => t.queue.send(ESTIMATION_JOB, { runId: kept }, { tx }));
    expect((await t.queue.pendingIds(ESTIMATION_JOB, 'runId')).has(kept)).toBe(true);
  });

  it('when the queue refuses the job, answers 503 and leaves no run behind', async () => {
    t.deps.jobs = {
      send: async () => {
        throw new Error('queue down');
      },
    };
    const before = await t.deps.db.select().from(runs);
    const res = await t.team.agents.analyst.post(study.base).send({ spec }).expect(503);
    expect(res.body.error.code).toBe('queue_unavailable');
    expect(await t.deps.db.select().from(runs)).toHaveLength(before.length);
  });
});

describe('the sweep of queued runs whose message was lost', () => {
  it('queues a recent one again (it runs to done) and fails an old one with a reason', async () => {
    const recent = await runWithLostMessage(5);
    const old = await runWithLostMessage(120);
    const fresh = await runWithLostMessage(0);
    const worker = await startJobQueue(t.deps, { kinds: createJobKinds(), work: true });
    try {
      // The worker sweeps when it starts.
      const deadline = Date.now() + 45_000;
      let row = await getRunForJob(t.deps.db, { id: recent });
      while (row && ['queued', 'running'].includes(row.status) && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 250));
        row = await getRunForJob(t.deps.db, { id: recent });
      }
      expect(row).toMatchObject({ status: 'done', error: null });
      expect(await getRunForJob(t.deps.db, { id: old })).toMatchObject({
        status: 'failed',
        error: expect.stringMatching(/lost/),
      });
      // A run queued a moment ago still has time for its message: left alone.
      expect((await getRunForJob(t.deps.db, { id: fresh }))?.status).toBe('queued');
    } finally {
      await worker.stop();
    }
  }, 60_000);
});
