/** The command line with the hierarchical Bayes and latent class families (scripts/estimate.ts). */
import { describe, expect, it } from 'vitest';
import { estimationResultSchema } from '../../../shared/schemas/estimation-spec';
import { simulateTwoClasses } from '../latent-class/latent-class-fixture';
import { runCli, scratchFiles } from './estimate-cli-harness';

const file = scratchFiles('cw-families-');

const sim = simulateTwoClasses(120, 6, 3);
const csv = (filter: (x: number, respondent: number) => number) =>
  [
    'respondent,task,alt,chosen,river,outages,bill,filters_water',
    ...sim.rows.map(
      (r) =>
        `${r.respondent},${r.task},${r.alt},${r.chosen},${Array.from(r.values).join(',')},${filter(sim.covariate[Number(r.respondent) - 1], Number(r.task))}`,
    ),
  ].join('\n');
const dataFile = file(
  'choices.csv',
  csv((x) => x),
);
const coefficients = [{ name: 'river' }, { name: 'outages' }, { name: 'bill' }];

describe('npm run estimate with model "hb"', () => {
  it('writes individuals with the mixed logit shape plus intervals, and diagnostics', async () => {
    const spec = {
      model: 'hb',
      coefficients: [
        { name: 'river', distribution: 'normal' },
        { name: 'outages', distribution: 'normal' },
        { name: 'bill', distribution: 'neg_lognormal' },
      ],
      correlated: true,
      cost: 'bill',
      mcmc: { iterations: 600, burnin: 300, thin: 3, chains: 2, seed: 5 },
    };
    const run = await runCli([
      '--data',
      dataFile,
      '--spec',
      file('hb.json', JSON.stringify(spec)),
      '--threads',
      '2',
    ]);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const result = estimationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.model).toBe('hb');
    expect(result.individuals).toHaveLength(120);
    const first = result.individuals![0];
    expect(Object.keys(first.mean)).toEqual(['river', 'outages', 'bill']);
    expect(Object.keys(first.sd)).toEqual(['river', 'outages', 'bill']);
    expect(Object.keys(first.lower!)).toEqual(['river', 'outages', 'bill']);
    expect(Object.keys(first.wtp!)).toEqual(['river', 'outages']);
    expect(result.diagnostics!.chains).toHaveLength(2);
    expect(result.diagnostics!.parameters.map((p) => p.name)).toContain('bill.variance');
    expect(result.sampler).toMatchObject({
      iterations: 600,
      burnin: 300,
      thin: 3,
      chains: 2,
      keptPerChain: 100,
    });
    expect(result.sampler!.priors).toMatchObject({
      preset: 'rossi',
      nu: 6,
      scale: 6,
      muVariance: 100,
    });
    expect(result.logMarginalDensity).toBeLessThan(0);
    expect(result.estimates.map((e) => e.name)).toContain('corr.outages.river');
  }, 120_000);
});

describe('npm run estimate with model "latent_class"', () => {
  it('writes classes, the class-count table and per-respondent class probabilities', async () => {
    const spec = {
      model: 'latent_class',
      coefficients,
      classes: [1, 2],
      starts: 3,
      membership: ['filters_water'],
      cost: 'bill',
    };
    const run = await runCli(['--data', dataFile, '--spec', file('lc.json', JSON.stringify(spec))]);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const result = estimationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.classSelection!.map((r) => r.classes)).toEqual([1, 2]);
    expect(result.classes!.length).toBeGreaterThanOrEqual(1);
    expect(result.membership).toEqual(['filters_water']);
    const p = result.individuals![0];
    expect(p.classProbabilities!.length).toBe(result.classes!.length);
    expect(p.likeliestClass).toBeGreaterThanOrEqual(1);
    expect(Object.keys(p.mean)).toEqual(['river', 'outages', 'bill']);
  }, 120_000);

  const bad: [string, () => string[], number, RegExp][] = [
    [
      'a membership column that changes within a respondent',
      () => [
        '--data',
        file(
          'varying.csv',
          csv((x, task) => (task === 2 ? 1 - x : x)),
        ),
        '--spec',
        file(
          'lc2.json',
          JSON.stringify({ model: 'latent_class', coefficients, membership: ['filters_water'] }),
        ),
      ],
      2,
      /filters_water changes within respondent/,
    ],
    [
      'more classes than the respondents can identify',
      () => [
        '--data',
        file(
          'small.csv',
          csv((x) => x)
            .split('\n')
            .filter((line, i) => i === 0 || Number(line.split(',')[0]) <= 60)
            .join('\n'),
        ),
        '--spec',
        file('lc8.json', JSON.stringify({ model: 'latent_class', coefficients, classes: 8 })),
      ],
      2,
      /8 classes need .* respondents; the data have 60/,
    ],
    [
      'hierarchical Bayes with a triangular coefficient',
      () => [
        '--data',
        dataFile,
        '--spec',
        file(
          'hbtri.json',
          JSON.stringify({
            model: 'hb',
            coefficients: [{ name: 'river', distribution: 'triangular' }],
          }),
        ),
      ],
      2,
      /coefficients.0.distribution: Hierarchical Bayes coefficients are normal/,
    ],
  ];
  for (const [what, args, status, message] of bad) {
    it(`refuses ${what} with exit code ${status}`, async () => {
      const run = await runCli(args());
      expect(run.status).toBe(status);
      expect(run.stderr).toMatch(message);
    });
  }
});
