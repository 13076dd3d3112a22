/**
 * Runs say how they read their respondents (docs/methods.md "Run data order"): a new run reads
 * them in respondent-number order and says so; a run stored before the order was (no
 * `dataOrder` in its stored spec) says 'respondent-id', and computed again it still reads them
 * by id, so it reproduces bit for bit (estimates and data hash).
 */
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { createTestApp, type TestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { runs } from '../../../db/schema/models';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import {
  hashChoiceData,
  loadStudyChoiceData,
} from '../../../server/services/choice-data-from-study';
import {
  ignoreTeardownErrors,
  mixedLogitSpec,
  seedRunStudy,
  type SeededStudy,
} from './run-fixtures';

let t: TestApp;
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let study: SeededStudy;
let base: string;

beforeAll(async () => {
  t = await createTestApp();
  ignoreTeardownErrors(t.deps.db);
  team = await createTeamWithAllRoles(t);
  study = await seedRunStudy(t.deps.db, { teamId: team.teamId, respondents: 30 });
  base = `/api/teams/${team.teamId}/studies/${study.studyId}/runs`;
});
afterAll(async () => {
  await t.close();
});
beforeEach(() => {
  t.deps.jobs = { send: async () => undefined };
});

const getRun = async (id: string) =>
  (await team.agents.viewer.get(`${base}/${id}`).expect(200)).body;
const keys = mixedLogitSpec(20, 9).coefficients.map((c) => c.column);

describe('run data order', () => {
  it('reads a new run in respondent-number order and says so', async () => {
    const res = await team.agents.analyst
      .post(base)
      .send({ spec: mixedLogitSpec(20, 9) })
      .expect(201);
    expect(res.body.dataOrder).toBe('respondent-number');
    await runEstimationJob(t.deps, res.body.id, { threads: 1 });
    const run = await getRun(res.body.id);
    expect(run.status).toBe('done');
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId: study.studyId });
    expect(run.dataHash).toBe(hashChoiceData(prepared, keys));
  }, 120_000);

  it('computes a run stored without a data order again in id order, bit for bit', async () => {
    const res = await team.agents.analyst
      .post(base)
      .send({ spec: mixedLogitSpec(20, 9) })
      .expect(201);
    // As a run stored before the data order was: its stored spec has no dataOrder.
    await t.deps.db
      .update(runs)
      .set({ spec: sql`${runs.spec} - 'dataOrder'` })
      .where(eq(runs.id, res.body.id));
    expect((await getRun(res.body.id)).dataOrder).toBe('respondent-id');
    await runEstimationJob(t.deps, res.body.id, { threads: 1 });
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
    await runEstimationJob(t.deps, res.body.id, { threads: 1 });
    const again = await getRun(res.body.id);
    expect(again.status).toBe('done');
    expect(again.dataHash).toBe(first.dataHash);
    expect(again.results.estimates).toEqual(first.results.estimates);
    expect(again.results.loglik).toBe(first.results.loglik);
  }, 120_000);
});
