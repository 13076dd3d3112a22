/**
 * HB recovery on simulated data (a known random-coefficient logit, simulate-panel-choices.ts):
 * - every population location lies within 2 posterior SD of its true value (the check;
 *   a Bayesian reading of "within two standard errors", common practice, no source);
 * - each respondent's posterior mean correlates with their true coefficient at least as well as
 *   the mixed logit's conditional mean (Revelt & Train 2000), less 0.05: both estimate the same
 *   E[β_n | y_n] and agree in large samples (Bernstein-von Mises; Train 2009, §12.2).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';
import { computeTasteProfiles } from '../../../server/engine/estimation/taste-profiles';
import { fitHb, type HbResult } from '../../../server/engine/hb/fit-hb';
import { pearson } from '../../support/pearson';

const truth = [
  { name: 'river', distribution: 'normal' as const, location: 0.8, spread: 0.6 },
  { name: 'outages', distribution: 'normal' as const, location: -0.5, spread: 0.4 },
  { name: 'renewables', distribution: 'normal' as const, location: 0.3, spread: 0.5 },
  {
    name: 'bill',
    distribution: 'neg_lognormal' as const,
    location: -1.2,
    spread: 0.4,
    levels: [0, 1, 2, 4, 6],
  },
];
const N = 250;
const { sim, data, coefficients } = simulateChoiceData({
  respondents: N,
  tasks: 12,
  alternatives: 3,
  coefficients: truth,
  seed: 31,
});

let hb: HbResult;
let mixedMeans: Record<string, number>[];

beforeAll(async () => {
  hb = await fitHb(data, {
    coefficients,
    iterations: 6000,
    // One MH step per iteration, as these checks were set with (the default takes more).
    steps: 1,
    burnin: 3000,
    thin: 5,
    chains: 2,
    seed: 3,
    cost: 'bill',
  });
  const mixed = await fitMixedLogit(data, { coefficients, draws: { count: 200, seed: 1 } });
  mixedMeans = computeTasteProfiles(data, mixed.layout, mixed.estimates, {
    count: 1000,
  }).profiles.map((p) => p.mean);
}, 300_000);

describe('HB recovery on simulated data', () => {
  it('population locations lie within 2 posterior SD of the truth', () => {
    truth.forEach((c, k) => {
      const { mean, sd } = hb.population.coefficients[k].location;
      expect(Math.abs(mean - c.location), c.name).toBeLessThan(2 * sd);
    });
  });

  it('individual posterior means track the true coefficients at least as well as the mixed logit, less 0.05', () => {
    truth.forEach((c, k) => {
      const actual = Array.from({ length: N }, (_, n) => sim.trueBetas[n * truth.length + k]);
      const rHb = pearson(
        hb.individuals.map((p) => p.mean[c.name]),
        actual,
      );
      const rMixed = pearson(
        mixedMeans.map((m) => m[c.name]),
        actual,
      );
      expect(rHb, c.name).toBeGreaterThanOrEqual(rMixed - 0.05);
      expect(rHb, c.name).toBeGreaterThan(0.3);
    });
  });

  it('reports per-respondent intervals that contain the mean, WTP per draw, and chains that agree', () => {
    const p = hb.individuals[0];
    for (const c of truth) {
      expect(p.lower[c.name]).toBeLessThanOrEqual(p.mean[c.name]);
      expect(p.upper[c.name]).toBeGreaterThanOrEqual(p.mean[c.name]);
      expect(p.sd[c.name]).toBeGreaterThan(0);
    }
    expect(Object.keys(p.wtp ?? {})).toEqual(['river', 'outages', 'renewables']);
    expect(p.wtpLower!.river).toBeLessThan(p.wtpUpper!.river);
    expect(hb.individuals.every((q) => q.mean.bill < 0)).toBe(true);
    // Population means mix well in this short run; variances of lognormal coefficients need longer chains.
    for (const p of hb.diagnostics.parameters.filter((q) => q.name.endsWith('.mean')))
      expect(p.rhat, p.name).toBeLessThan(1.05);
    for (const chain of hb.diagnostics.chains) {
      expect(chain.acceptance).toBeGreaterThan(0.2);
      expect(chain.acceptance).toBeLessThan(0.4);
    }
    // Simulated LL at the posterior means sits near the mixed logit's maximum (Bernstein-von Mises).
    expect(hb.fit.loglik).toBeLessThan(0);
    expect(hb.fit.individualHitRate).toBeGreaterThan(hb.fit.hitRate);
  });
});
