/**
 * HB and latent class runs end to end in-process: the API enqueues, the job handler fits,
 * stores the family's diagnostics or classes in the results and each respondent's intervals
 * or class probabilities beside the profile, and reports progress as iterations or starts; their
 * exports carry the family's per-respondent columns and a methods sheet.
 */
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { downloadXlsx } from '../../support/download-xlsx';
import { useTestApp } from '../../support/test-app';
import { useEstimationPool } from '../../support/engine-pools';
import { listRunProfiles } from '../../../db/queries/taste-profiles';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import { useRunStudy } from './run-fixtures';
import { scenarioLevels } from '../routes/tastes-fixture';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });
const pool = useEstimationPool();
const done: Record<string, string> = {};

const coefficients = [
  { name: 'bill', column: 'attr:bill' },
  { name: 'river_good', column: 'attr:river:good' },
  { name: 'interrupt', column: 'attr:interrupt' },
  { name: 'sq', column: 'asc:fixed' },
];

const study = useRunStudy(t, 80, 180_000);

describe('HB run through the job', () => {
  it('ends done with diagnostics, sampler settings and per-respondent intervals', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
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
    await runEstimationJob(t.deps, res.body.id, { threads: 2, pool });
    done.hb = res.body.id;
    const run = (await t.team.agents.viewer.get(`${study.base}/${res.body.id}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    expect(run.progress).toMatchObject({ maxIterations: 600 });
    expect(run.results.diagnostics.chains).toHaveLength(2);
    expect(run.results.diagnostics.parameters.map((p: { name: string }) => p.name)).toContain(
      'river_good.mean',
    );
    expect(run.results.sampler).toMatchObject({ iterations: 600, chains: 2, seed: 7 });
    expect(run.results.sampler.priors.preset).toBe('train');
    const profiles = await listRunProfiles(t.deps.db, {
      runId: res.body.id,
      studyId: study.studyId,
    });
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
    const res = await t.team.agents.analyst
      .post(study.base)
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
    await runEstimationJob(t.deps, res.body.id, { threads: 1, pool });
    done.lc = res.body.id;
    const run = (await t.team.agents.viewer.get(`${study.base}/${res.body.id}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    expect(run.progress.maxIterations).toBe(4);
    expect(run.results.classSelection.map((r: { classes: number }) => r.classes)).toEqual([1, 2]);
    const shares = run.results.classes.map((c: { share: number }) => c.share);
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 10);
    const profiles = await listRunProfiles(t.deps.db, {
      runId: res.body.id,
      studyId: study.studyId,
    });
    expect(profiles).toHaveLength(80);
    const extra = profiles[0].extra as { classProbabilities: number[]; likeliestClass: number };
    expect(extra.classProbabilities).toHaveLength(run.results.classes.length);
    expect(extra.classProbabilities.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 10);
    expect(extra.likeliestClass).toBeGreaterThanOrEqual(1);
  }, 180_000);
});

describe('GET /tastes/compare', () => {
  it('pairs the two runs respondent by respondent, with a correlation per shared coefficient', async () => {
    const tastes = `/api/teams/${t.team.teamId}/studies/${study.studyId}/tastes/compare`;
    const res = await t.team.agents.viewer
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
    const tastes = `/api/teams/${t.team.teamId}/studies/${study.studyId}/tastes/compare`;
    const res = await t.team.agents.viewer
      .get(tastes)
      .query({ runId: done.hb, otherRunId: done.hb })
      .expect(400);
    expect(res.body.error.fields[0].path).toBe('otherRunId');
  });
});

/** The Methods sheet as rows of cell values (empty rows dropped). */
async function loadMethods(runId: string): Promise<unknown[][]> {
  const { workbook } = await downloadXlsx(
    t.team.agents.viewer,
    `/api/teams/${t.team.teamId}/studies/${study.studyId}/exports/taste-profiles.xlsx`,
    { runId },
  );
  expect(workbook.worksheets.map((w) => w.name).slice(0, 3)).toEqual([
    'About',
    'Profiles',
    'Methods',
  ]);
  const rows: unknown[][] = [];
  workbook.getWorksheet('Methods')!.eachRow((row) => rows.push((row.values as unknown[]).slice(1)));
  return rows;
}

async function loadCsv(runId: string): Promise<Record<string, string>[]> {
  const res = await t.team.agents.viewer
    .get(`/api/teams/${t.team.teamId}/studies/${study.studyId}/exports/taste-profiles.csv`)
    .query({ runId })
    .expect(200);
  return parse(res.text, { columns: true }) as Record<string, string>[];
}

describe('exports of HB and latent class runs', () => {
  it('HB CSV: posterior mean, SD and 95 % interval of each coefficient and WTP', async () => {
    const rows = await loadCsv(done.hb);
    expect(rows).toHaveLength(80);
    const header = Object.keys(rows[0]);
    for (const n of ['bill', 'river_good', 'interrupt', 'sq'])
      expect(header).toEqual(
        expect.arrayContaining([`mean_${n}`, `sd_${n}`, `lower95_${n}`, `upper95_${n}`]),
      );
    for (const n of ['river_good', 'interrupt'])
      expect(header).toEqual(
        expect.arrayContaining([`wtp_${n}`, `wtp_sd_${n}`, `wtp_lower95_${n}`, `wtp_upper95_${n}`]),
      );
    expect(header).not.toContain('likeliest_class');
    for (const r of rows) {
      const [mean, lower, upper] = ['mean', 'lower95', 'upper95'].map((k) =>
        Number(r[`${k}_river_good`]),
      );
      expect(lower).toBeLessThanOrEqual(mean);
      expect(upper).toBeGreaterThanOrEqual(mean);
      expect(Number(r.sd_river_good)).toBeGreaterThan(0);
      expect(Number(r.upper95_bill)).toBeLessThan(0);
    }
  });

  it('HB methods sheet: priors, sampler settings and R-hat/ESS per parameter', async () => {
    const rows = await loadMethods(done.hb);
    const text = rows.map((r) => r.join(' | '));
    // Train (2009) preset with K = 3 random coefficients: IW(3, 3·I).
    expect(text).toContain('Covariance Σ | IW(ν = 3, 3·I)');
    expect(text).toContain('Population means μ | N(0, 100·I)');
    expect(text).toContain('Iterations per chain | 600');
    expect(text).toContain('Burn-in | 300');
    expect(text).toContain('Thinning | 3');
    expect(text).toContain('Seed | 7');
    const rhat = rows.find((r) => r[0] === 'river_good.mean')!;
    expect(typeof rhat[1]).toBe('number');
    expect(typeof rhat[2]).toBe('number');
    expect(rows.filter((r) => r[0] === 1 || r[0] === 2)).toHaveLength(2); // one row per chain
  });

  it('latent class CSV: likeliest class and one probability column per class, summing to 1', async () => {
    const run = (
      await t.team.agents.viewer
        .get(`/api/teams/${t.team.teamId}/studies/${study.studyId}/runs/${done.lc}`)
        .expect(200)
    ).body;
    const C = run.results.classes.length as number;
    const rows = await loadCsv(done.lc);
    const header = Object.keys(rows[0]);
    const probs = Array.from({ length: C }, (_, i) => `p_class_${i + 1}`);
    expect(header).toEqual(
      expect.arrayContaining(['likeliest_class', 'effective_classes', ...probs]),
    );
    expect(header).not.toContain('low_effective_draws');
    for (const r of rows) {
      const p = probs.map((k) => Number(r[k]));
      expect(p.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 8);
      expect(Number(r.likeliest_class)).toBe(p.indexOf(Math.max(...p)) + 1);
    }
  });

  it('latent class methods sheet: the class-count table and each class with SEs', async () => {
    const rows = await loadMethods(done.lc);
    const head = rows.findIndex((r) => r[0] === 'Classes' && r[1] === 'LL');
    expect(head).toBeGreaterThan(0);
    expect(rows[head + 1][0]).toBe(1);
    expect(rows[head + 2][0]).toBe(2);
    expect(rows.some((r) => typeof r[0] === 'string' && /^Class 1: share/.test(r[0]))).toBe(true);
  });
});

describe('shares and segments of HB and latent class runs', () => {
  const levels = scenarioLevels;
  const simulate = (runId: string, segmentBy: unknown = null) =>
    t.team.agents.viewer
      .post(`/api/teams/${t.team.teamId}/studies/${study.studyId}/shares/simulate`)
      .send({
        runId,
        alternatives: [
          { name: 'Good river', levels: levels('good') },
          { name: 'Poor river', levels: levels('poor') },
        ],
        includeFixed: true,
        segmentBy,
      });

  it('HB shares average every respondent’s posterior means', async () => {
    const res = await simulate(done.hb).expect(200);
    expect(res.body.method).toBe('posterior_means');
    expect(res.body.respondents).toBe(80);
    const shares = res.body.alternatives.map((a: { share: number }) => a.share);
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 12);
    // Simulated with a positive river effect (run-fixtures TRUE_MNL).
    expect(shares[0]).toBeGreaterThan(shares[1]);
  });

  it('latent class shares are class-weighted, and split by the likeliest class', async () => {
    const res = await simulate(done.lc, { groupBy: 'class' }).expect(200);
    expect(res.body.method).toBe('class_weighted');
    expect(res.body.segments.label).toBe('Likeliest latent class');
    const counts = res.body.segments.groups.map((g: { count: number }) => g.count);
    expect(counts.reduce((a: number, b: number) => a + b, 0)).toBe(80);
    expect(res.body.segments.groups[0].label).toMatch(/^Class 1 \(\d+\s?%\)$/);
  });

  it('Tastes segments by likeliest class for a latent class run; 400 on groupBy for HB', async () => {
    const url = `/api/teams/${t.team.teamId}/studies/${study.studyId}/tastes/segments`;
    const lc = await t.team.agents.viewer
      .get(url)
      .query({ runId: done.lc, coefficient: 'river_good', groupBy: 'class' })
      .expect(200);
    expect(lc.body.groupLabel).toBe('Likeliest latent class');
    expect(lc.body.ungrouped).toBe(0);
    const hb = await t.team.agents.viewer
      .get(url)
      .query({ runId: done.hb, coefficient: 'river_good', groupBy: 'class' })
      .expect(400);
    expect(hb.body.error.fields[0].path).toBe('groupBy');
  });
});
