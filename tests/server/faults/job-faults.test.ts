/**
 * Faults around background jobs: the worker's database connections break while an
 * estimation runs. Progress writes fail and are logged, the process keeps running, and the
 * finished estimation is still saved once PostgreSQL is back.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { getRunForJob } from '../../../db/queries/runs';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import { mixedLogitSpec, seedRunStudy } from '../jobs/run-fixtures';

const t = useTestApp({}, { signIn: 'team', faultProxy: true });
let base: string;

beforeAll(async () => {
  const study = await seedRunStudy(t.testDb.db, { teamId: t.team.teamId, respondents: 60 });
  base = `/api/teams/${t.team.teamId}/studies/${study.studyId}/runs`;
  t.deps.jobs = { send: async () => {} };
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('estimation while PostgreSQL restarts', () => {
  it('keeps estimating through the outage and saves the run when the database is back', async () => {
    const res = await t.team.agents.analyst
      .post(base)
      .send({ spec: mixedLogitSpec(100, 3) })
      .expect(201);
    const job = runEstimationJob(t.deps, res.body.id, { threads: 1 });
    for (let i = 0; i < 400; i++) {
      const row = await getRunForJob(t.testDb.db, { id: res.body.id });
      if (row?.status !== 'queued') break;
      await sleep(25);
    }
    t.proxy.refuse();
    await sleep(2_500);
    t.proxy.resume();
    await job;
    const row = await getRunForJob(t.testDb.db, { id: res.body.id });
    expect(row?.error).toBeNull();
    expect(row?.status).toBe('done');
  }, 60_000);
});
