/**
 * Faults around background jobs: the worker's database connections break while an
 * estimation runs. Progress writes fail and are logged, the process keeps running, and the
 * finished estimation is still saved once PostgreSQL is back.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../../support/test-app';
import { startTcpProxy, type TcpProxy } from '../../support/tcp-proxy';
import { createTeamWithAllRoles } from '../../support/factories';
import { getRunForJob } from '../../../db/queries/runs';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import { ignoreTeardownErrors, mixedLogitSpec, seedRunStudy } from '../jobs/run-fixtures';

let t: TestApp;
let proxy: TcpProxy;
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let base: string;

beforeAll(async () => {
  const pgUrl = new URL(process.env.CW_TEST_ADMIN_URL!);
  proxy = await startTcpProxy({ host: pgUrl.hostname, port: Number(pgUrl.port) });
  t = await createTestApp({}, { viaProxy: proxy });
  ignoreTeardownErrors(t.deps.db);
  team = await createTeamWithAllRoles(t);
  const study = await seedRunStudy(t.testDb.db, { teamId: team.teamId, respondents: 60 });
  base = `/api/teams/${team.teamId}/studies/${study.studyId}/runs`;
  t.deps.jobs = { send: async () => {} };
});
afterAll(async () => {
  await t.close();
  await proxy.close();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('estimation while PostgreSQL restarts', () => {
  it('keeps estimating through the outage and saves the run when the database is back', async () => {
    const res = await team.agents.analyst
      .post(base)
      .send({ spec: mixedLogitSpec(100, 3) })
      .expect(201);
    const job = runEstimationJob(t.deps, res.body.id, { threads: 1 });
    for (let i = 0; i < 400; i++) {
      const row = await getRunForJob(t.testDb.db, { id: res.body.id });
      if (row?.status !== 'queued') break;
      await sleep(25);
    }
    proxy.refuse();
    await sleep(2_500);
    proxy.resume();
    await job;
    const row = await getRunForJob(t.testDb.db, { id: res.body.id });
    expect(row?.error).toBeNull();
    expect(row?.status).toBe('done');
  }, 60_000);
});
