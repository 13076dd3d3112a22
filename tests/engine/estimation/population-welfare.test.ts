/**
 * Population-mean welfare of a scenario under a mixed logit (population-welfare.ts). Check
 * values:
 *  - fixed coefficients: the log-sum formula by hand (Small & Rosen 1981; Train 2009 §3.5,
 *    eq. 3.10): a scenario alternative with V = ln 3 beside a status quo with V = 0 and
 *    α = 0.5 gives CV = ln(1 + 3)/0.5 = 2·ln 4;
 *  - lognormal cost −exp(b + sη) absent from the scenario: CV = ln 4 · E[e^{−b−sη}]
 *    = ln 4 · e^{−b+s²/2} (the lognormal's moments, Johnson, Kotz & Balakrishnan 1994 ch. 14);
 *  - lognormal cost that differs between alternatives: a 60-node Gauss–Hermite quadrature of
 *    the same integral (Abramowitz & Stegun 1964 §25.4.46);
 *  - a normal cost: withheld (E[1/β_cost] does not exist; Daly, Hess & Train 2012);
 *  - the Krinsky–Robb interval of a monotone function of one uncertain estimate: the function at
 *    θ̂ ± 1.96σ, up to the percentile error of 1,000 draws.
 * Tolerances of simulated values: three Monte Carlo standard errors, SD/√R, an upper bound for
 * the (smaller) error of scrambled Halton draws (Train 2009 §9.3.3).
 */
import { describe, expect, it } from 'vitest';
import { computeGaussHermite } from '../../../server/engine/linalg/gauss-hermite';
import { uncorrelatedLayout } from './uncorrelated-layout';
import { computePopulationWelfare } from '../../../server/engine/estimation/population-welfare';

const columns = { columns: ['river', 'bill'] };
const draws = { type: 'halton' as const, count: 2000, seed: 7 };
/** Scenario: alternative A (river 1, bill as given) beside the status quo (0, 0). */
const scenario = (bill: number) => ({
  alternativeCount: 2,
  alternatives: Float64Array.of(1, bill, 0, 0),
  baseline: 1,
  cost: 1,
});

type Dist = 'fixed' | 'normal' | 'neg_lognormal';
const layoutOf = (river: Dist, bill: Dist) => uncorrelatedLayout(columns, { river, bill });
const welfareOf = (
  layout: ReturnType<typeof layoutOf>,
  theta: number[],
  bill = 0,
  covariance: Float64Array | null = null,
) =>
  computePopulationWelfare({
    layout,
    theta: Float64Array.from(theta),
    covariance,
    ...scenario(bill),
    draws,
    parameterDraws: covariance ? 1000 : 100,
  });

describe('population welfare of a scenario (mixed logit)', () => {
  it('with fixed coefficients equals the log-sum formula by hand', () => {
    const layout = layoutOf('fixed', 'fixed');
    const out = welfareOf(layout, [Math.log(3), -0.5]);
    expect(out.reason).toBeNull();
    expect(out.estimate!.estimate).toBeCloseTo(2 * Math.log(4), 12);
  });

  it('with a lognormal cost absent from the scenario equals ln 4 · e^{−b+s²/2}', () => {
    const layout = layoutOf('fixed', 'neg_lognormal');
    const b = Math.log(0.5);
    const s = 0.6;
    expect(layout.names).toEqual(['river', 'bill.mean', 'bill.sd']);
    const out = welfareOf(layout, [Math.log(3), b, s]);
    const exact = Math.log(4) * Math.exp(-b + (s * s) / 2);
    // SD of ln 4 · e^{−b−sη}: its mean times √(e^{s²} − 1).
    const sd = exact * Math.sqrt(Math.exp(s * s) - 1);
    expect(Math.abs(out.estimate!.estimate - exact)).toBeLessThan((3 * sd) / Math.sqrt(2000));
  });

  it('with a lognormal cost that differs between alternatives matches Gauss–Hermite quadrature', () => {
    const layout = layoutOf('normal', 'neg_lognormal');
    const [m, b, sRiver, s] = [1.2, Math.log(0.4), 0.8, 0.5];
    // θ order: means of all coefficients, then spreads (mixed-logit-layout.ts).
    expect(layout.names).toEqual(['river.mean', 'bill.mean', 'river.sd', 'bill.sd']);
    const out = welfareOf(layout, [m, b, sRiver, s], 2);
    // E over two independent standard normals by a 60 × 60 product Gauss–Hermite rule.
    const { nodes, weights } = computeGaussHermite(60);
    let exact = 0;
    let second = 0;
    for (let i = 0; i < nodes.length; i++)
      for (let j = 0; j < nodes.length; j++) {
        const river = m + sRiver * Math.SQRT2 * nodes[i];
        const alpha = Math.exp(b + s * Math.SQRT2 * nodes[j]);
        const va = river - alpha * 2;
        const cv = (Math.max(va, 0) + Math.log1p(Math.exp(-Math.abs(va)))) / alpha;
        const w = (weights[i] * weights[j]) / Math.PI;
        exact += w * cv;
        second += w * cv * cv;
      }
    const sd = Math.sqrt(second - exact * exact);
    expect(Math.abs(out.estimate!.estimate - exact)).toBeLessThan((3 * sd) / Math.sqrt(2000));
  });

  it('withholds the figure when the cost is normal or positive, with the reason', () => {
    const normal = layoutOf('fixed', 'normal');
    const out = welfareOf(normal, [1, -0.5, 0.2]);
    expect(out.estimate).toBeNull();
    expect(out.reason).toMatch(/reaches zero in the population/);
    const fixed = layoutOf('fixed', 'fixed');
    const positive = welfareOf(fixed, [1, 0.5]);
    expect(positive.reason).toMatch(/positive/);
  });

  it('gives the Krinsky–Robb interval of the estimates: W(θ̂ ± 1.96σ) for one uncertain estimate', () => {
    const layout = layoutOf('fixed', 'fixed');
    const sigma = 0.2;
    const W = (river: number) => Math.log1p(Math.exp(river)) / 0.5;
    // The cost's variance is negligible but positive: Krinsky–Robb needs a positive-definite V.
    const out = welfareOf(layout, [1, -0.5], 0, Float64Array.of(sigma * sigma, 0, 0, 1e-14));
    const e = out.estimate!;
    // Percentile error of the 2.5 % point of 1,000 normal draws: √(p(1−p)/n)/φ(1.96) ≈ 0.085 σ;
    // three of them.
    const slack = 3 * 0.085;
    expect(e.lower!).toBeGreaterThan(W(1 - (1.96 + slack) * sigma));
    expect(e.lower!).toBeLessThan(W(1 - (1.96 - slack) * sigma));
    expect(e.upper!).toBeGreaterThan(W(1 + (1.96 - slack) * sigma));
    expect(e.upper!).toBeLessThan(W(1 + (1.96 + slack) * sigma));
    // Delta method beside it: se = W′(θ̂)·σ with W′ = logistic(θ̂)/0.5.
    expect(e.se!).toBeCloseTo(sigma / (1 + Math.exp(-1)) / 0.5, 6);
  });
});
