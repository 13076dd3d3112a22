/**
 * HB and latent class runs end to end in-process: the API enqueues, the job handler fits,
 * stores the family's diagnostics or classes in the results and each respondent's intervals
 * or class probabilities beside the profile, and reports progress as iterations or starts.
 */
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { listTasteProfiles } from '../../../db/queries/taste-profiles';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import { ignoreTeardownErrors, seedRunStudy, type SeededStudy } from './run-fixtures';

let t: TestApp;
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let study: SeededStudy;
let base: string;
const done: Record<string, string> = {};

const coefficients = [
  { name: 'bill', column: 'attr:bill' },
  { name: 'river_good', column: 'attr:river:good' },
  { name: 'interrupt', column: 'attr:interrupt' },
  { name: 'sq', column: 'asc:fixed' },
];

beforeAll(async () => {
  t = await createTestApp();
  ignoreTeardownErrors(t.deps.db);
  team = await createTeamWithAllRoles(t);
  study = await seedRunStudy(t.deps.db, { teamId: team.teamId, respondents: 80 });
  base = `/api/teams/${team.teamId}/studies/${study.studyId}/runs`;
}, 180_000);
afterAll(async () => {
  await t.close();
});
beforeEach(() => {
  t.deps.jobs = { send: async () => undefined };
});

describe('HB run through the job', () => {
  it('ends done with diagnostics, sampler settings and per-respondent intervals', async () => {
    const res = await team.agents.analyst
      .post(base)
      .send({
        spec: {
          model: 'hb',
          coefficients: coefficients.map((c) => ({
            ...c,
            distribution:
              c.name === 'bill' ? 'neg_lognormal' : c.name === 'sq' ? 'fixed' : 'normal',
          })),
          cost: 'bill',
          mcmc: { iterations: 600, burnin: 300, thin: 3, chains: 2, seed: 7 },
          priors: { preset: 'train' },
        },
      })
      .expect(201);
    expect(res.body.name).toBe('Hierarchical Bayes logit');
    expect(res.body.model).toBe('hb');
    expect(res.body.seed).toBe(7);
    await runEstimationJob(t.deps, res.body.id, { threads: 2 });
    done.hb = res.body.id;
    const run = (await team.agents.viewer.get(`${base}/${res.body.id}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    expect(run.progress).toMatchObject({ maxIterations: 600 });
    expect(run.results.diagnostics.chains).toHaveLength(2);
    expect(run.results.diagnostics.parameters.map((p: { name: string }) => p.name)).toContain(
      'river_good.mean',
    );
    expect(run.results.sampler).toMatchObject({ iterations: 600, chains: 2, seed: 7 });
    expect(run.results.sampler.priors.preset).toBe('train');
    const profiles = await listTasteProfiles(t.deps.db, { runId: res.body.id });
    expect(profiles).toHaveLength(80);
    const p = profiles[0];
    const extra = p.extra as { lower: Record<string, number>; upper: Record<string, number> };
    const mean = p.mean as Record<string, number>;
    // A 95 % posterior interval holds the posterior mean.
    for (const name of ['bill', 'river_good', 'interrupt']) {
      expect(extra.lower[name]).toBeLessThanOrEqual(mean[name]);
      expect(extra.upper[name]).toBeGreaterThanOrEqual(mean[name]);
    }
    expect(extra.upper.bill).toBeLessThan(0);
  }, 180_000);
});

describe('latent class run through the job', () => {
  it('ends done with the classes, the class-count table and class probabilities', async () => {
    const res = await team.agents.analyst
      .post(base)
      .send({
        spec: {
          model: 'latent_class',
          coefficients,
          classes: [1, 2],
          starts: 2,
          cost: 'bill',
        },
      })
      .expect(201);
    await runEstimationJob(t.deps, res.body.id, { threads: 1 });
    done.lc = res.body.id;
    const run = (await team.agents.viewer.get(`${base}/${res.body.id}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    expect(run.progress.maxIterations).toBe(4);
    expect(run.results.classSelection.map((r: { classes: number }) => r.classes)).toEqual([1, 2]);
    const shares = run.results.classes.map((c: { share: number }) => c.share);
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 10);
    const profiles = await listTasteProfiles(t.deps.db, { runId: res.body.id });
    expect(profiles).toHaveLength(80);
    const extra = profiles[0].extra as { classProbabilities: number[]; likeliestClass: number };
    expect(extra.classProbabilities).toHaveLength(run.results.classes.length);
    expect(extra.classProbabilities.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 10);
    expect(extra.likeliestClass).toBeGreaterThanOrEqual(1);
  }, 180_000);
});

describe('GET /tastes/compare', () => {
  it('pairs the two runs respondent by respondent, with a correlation per shared coefficient', async () => {
    const tastes = `/api/teams/${team.teamId}/studies/${study.studyId}/tastes/compare`;
    const res = await team.agents.viewer
      .get(tastes)
      .query({ runId: done.hb, otherRunId: done.lc })
      .expect(200);
    expect(res.body.run.model).toBe('hb');
    expect(res.body.other.model).toBe('latent_class');
    expect(res.body.respondents).toBe(80);
    const river = res.body.coefficients.find((c: { name: string }) => c.name === 'river_good');
    expect(river.pairs).toHaveLength(80);
    // On single-MNL data BIC may choose one class: every respondent then has the same mean, and
    // a correlation with no spread on one side is not defined (null).
    const spread = new Set(river.pairs.map((p: [number, number]) => p[1].toFixed(12))).size > 1;
    if (spread) expect(Math.abs(river.correlation)).toBeLessThanOrEqual(1);
    else expect(river.correlation).toBeNull();
    expect(JSON.stringify(res.body)).not.toContain(study.respondentIds[0]);
  });

  it('when both runs are the same, returns 400 on otherRunId', async () => {
    const tastes = `/api/teams/${team.teamId}/studies/${study.studyId}/tastes/compare`;
    const res = await team.agents.viewer
      .get(tastes)
      .query({ runId: done.hb, otherRunId: done.hb })
      .expect(400);
    expect(res.body.error.fields[0].path).toBe('otherRunId');
  });
});
