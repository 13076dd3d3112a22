/**
 * Population WTP under every distribution. Check values are closed forms or independent
 * quadratures computed here (Gauss-Hermite, Abramowitz & Stegun 1964 §25.4.46):
 *  - lognormal cost c = −exp(b + sη), fixed β_k: mean WTP = β_k·E[e^{−b−sη}] = β_k·e^{−b+s²/2}
 *    (the lognormal's moments, Johnson, Kotz & Balakrishnan 1994 ch. 14), which exceeds the
 *    ratio of means β_k/e^{b+s²/2} by the factor e^{s²}; median WTP = β_k·e^{−b};
 *  - normal β_k with a lognormal cost: P(WTP ≤ median) = ½, checked by a 2-D quadrature;
 *  - a normal cost: WTP withheld with the reason (E[1/β_cost] does not exist).
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { normalCdf } from '../../../server/engine/estimation/coefficient-distributions';
import { uncorrelatedLayout } from './uncorrelated-layout';
import {
  computePopulationWtp,
  getWtpWithheldReason,
} from '../../../server/engine/estimation/population-wtp';
import { computeGaussHermite } from '../../../server/engine/linalg/gauss-hermite';

const data = buildChoiceData(
  ['x', 'cost'],
  [
    { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1, 0] },
    { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0, 1] },
  ],
).data;

describe('population WTP', () => {
  it('lognormal cost: mean WTP is the closed form and e^{s²} times the ratio of means', () => {
    const layout = uncorrelatedLayout(data, { x: 'fixed', cost: 'neg_lognormal' });
    const [bx, b, s] = [0.8, -0.5, 0.6]; // θ = [x, cost.mean, cost.sd]
    const [wtp] = computePopulationWtp(layout, [bx, b, s], null, 1);
    const closed = bx * Math.exp(-b + (s * s) / 2);
    expect(wtp.mean.estimate).toBeCloseTo(closed, 12);
    const ratioOfMeans = bx / Math.exp(b + (s * s) / 2);
    expect(wtp.mean.estimate / ratioOfMeans).toBeCloseTo(Math.exp(s * s), 12);
    expect(wtp.median.estimate).toBeCloseTo(bx * Math.exp(-b), 12);
  });

  it('normal attribute and lognormal cost: the median solves P(WTP ≤ m) = ½ (2-D quadrature)', () => {
    const layout = uncorrelatedLayout(data, { x: 'normal', cost: 'neg_lognormal' });
    // θ = [x.mean, cost.mean, x.sd, cost.sd]
    const theta = [0.5, -0.3, 1.2, 0.7];
    const [wtp] = computePopulationWtp(layout, theta, null, 1);
    const { nodes, weights } = computeGaussHermite(60);
    let p = 0;
    for (let i = 0; i < nodes.length; i++) {
      const c = Math.exp(-0.3 + 0.7 * Math.SQRT2 * nodes[i]);
      p += (weights[i] / Math.sqrt(Math.PI)) * normalCdf((wtp.median.estimate * c - 0.5) / 1.2);
    }
    expect(p).toBeCloseTo(0.5, 6); // erfc of Press et al. has fractional error < 1.2e-7
    expect(wtp.mean.estimate).toBeCloseTo(0.5 * Math.exp(0.3 + 0.49 / 2), 12);
  });

  it('delta-method and simulated intervals come from the covariance given', () => {
    const layout = uncorrelatedLayout(data, { x: 'fixed', cost: 'fixed' });
    // Closed-form check: β_k = 0.8, β_c = −0.04, Var 0.01 and 0.0001, Cov 0.0002 give
    // WTP 20 and delta SE 6.020797289396148 (closed form of the delta method, Hole 2007).
    const cov = Float64Array.from([0.01, 0.0002, 0.0002, 0.0001]);
    const [wtp] = computePopulationWtp(layout, [0.8, -0.04], cov, 1, { draws: 4000, seed: 5 });
    expect(wtp.mean.estimate).toBeCloseTo(20, 12);
    expect(wtp.mean.se!).toBeCloseTo(6.020797289396148, 5);
    expect(wtp.mean.lower!).toBeLessThan(20);
    expect(wtp.mean.upper!).toBeGreaterThan(20);
  });

  it('a normal cost withholds WTP with the reason', () => {
    const layout = uncorrelatedLayout(data, { x: 'fixed', cost: 'normal' });
    expect(getWtpWithheldReason(layout, [0.8, -0.5, 0.3], 1)).toMatch(
      /cost coefficient cost has a normal distribution that reaches zero/,
    );
  });
});
