/**
 * Bayesian D-error against the closed form of docs/methods.md "Design check values" Check E [C]: one ±1 attribute,
 * one pair (+1 vs −1), β ~ N(0, σ²): I = 4p(1−p), p = logistic(2β), so
 * D_B = E[1/I] = E[(1 + cosh 2β)/2] = (1 + e^(2σ²))/2.
 *
 * Tolerance: the Koksma–Hlawka inequality |Q − I| ≤ V(g)·D*_N (Niederreiter 1992, *Random
 * Number Generation and Quasi-Monte Carlo Methods*, Thm 2.9 [M]) for the integrand clamped to
 * the range [a, b] spanned by the points (the rule only sees that range, so Q(f) = Q(g)),
 * plus the exactly computed error of the clamping, ∫ |f − g|. D*_N is the exact
 * one-dimensional star discrepancy of the points actually used (Niederreiter 1992, Thm 2.6
 * [M]): D* = 1/(2N) + max_i |u_(i) − (2i − 1)/(2N)|. f(u) = (1 + cosh(2σΦ⁻¹(u)))/2 is
 * decreasing then increasing with its minimum 1 at u = ½, so V(g) = f(a) + f(b) − 2.
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { buildDesignMatrix } from '../../../server/engine/design/design-grid';
import {
  computeDesignCriterion,
  getDErrorSetup,
} from '../../../server/engine/design/design-criteria';
import { fillUniformDraws } from '../../../server/engine/draws/uniform-draws';
import { inverseNormal as getInverseNormal } from '../../../server/engine/draws/inverse-normal';
import { buildPriorDraws } from '../../../server/engine/design/prior-draws';
import { makeGrid, makeSymmetricDefinition } from './design-fixtures';

/** ∫_{−∞}^{z} (1 + cosh 2σt)/2 φ(t) dt by composite Simpson on [z − 14, z] (tail < 1e-40). */
function integrateTail(sigma: number, z: number): number {
  const n = 20000;
  const lo = z - 14;
  const h = (z - lo) / n;
  const f = (t: number) =>
    ((1 + Math.cosh(2 * sigma * t)) / 2) * (Math.exp((-t * t) / 2) / Math.sqrt(2 * Math.PI));
  let s = f(lo) + f(z);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * f(lo + i * h);
  return (s * h) / 3;
}

function getKoksmaHlawkaBound(sigma: number, points: Float64Array): number {
  const N = points.length;
  const u = Array.from(points).sort((p, q) => p - q);
  let dev = 0;
  u.forEach((v, i) => (dev = Math.max(dev, Math.abs(v - (2 * i + 1) / (2 * N)))));
  const discrepancy = 1 / (2 * N) + dev;
  const f = (p: number) => (1 + Math.cosh(2 * sigma * getInverseNormal(p))) / 2;
  const a = u[0];
  const b = u[N - 1];
  const variation = f(a) + f(b) - 2;
  // By symmetry of f, the upper clamp error equals a lower one at 1 − b.
  const clampError =
    Math.abs(a * f(a) - integrateTail(sigma, getInverseNormal(a))) +
    Math.abs((1 - b) * f(b) - integrateTail(sigma, getInverseNormal(1 - b)));
  return variation * discrepancy + clampError;
}

describe('Bayesian D-error, computeDesignCriterion (Check E)', () => {
  const plan = buildCodingPlan(makeSymmetricDefinition([2], 2));
  const x = buildDesignMatrix(plan, makeGrid([[[0], [1]]]));

  it.each([
    // docs/methods.md "Design check values" Check E [C]: σ = 1 -> 4.194528049465325; σ = 0.5 -> 1.324360635350064.
    // At σ = 1 the integrand grows like e^(2|β|), so the bound at R = 200 is not informative
    // (measured error there: 18 % low); only larger R are checked. The bound grows with the
    // integrand at the most extreme point, and random digit scrambling of every digit (the
    // generator of version 2) reaches further into the tails than the earlier scrambling
    // did, so at σ = 1 it is informative (under 20 % of the value) from R = 20,000 on; at
    // R = 2,000 the error must still lie within it. Measured errors at seed 7 (version 2 vs
    // version 1): σ = 1, R = 2,000: −0.18 % vs −7.7 %; R = 20,000: +1.6 % vs −1.6 %;
    // σ = 0.5, R = 2,000: −0.15 % vs −0.49 %.
    { sigma: 1, exact: 4.194528049465325, R: 2000, informative: false },
    { sigma: 1, exact: 4.194528049465325, R: 20000, informative: true },
    { sigma: 0.5, exact: 1.324360635350064, R: 200, informative: true },
    { sigma: 0.5, exact: 1.324360635350064, R: 2000, informative: true },
  ])(
    'σ = $sigma with $R Halton draws is within the Koksma–Hlawka bound',
    ({ sigma, exact, R, informative }) => {
      expect((1 + Math.exp(2 * sigma * sigma)) / 2).toBeCloseTo(exact, 12);
      const draws = buildPriorDraws(Float64Array.of(0), Float64Array.of(sigma), R, 7);
      const value = computeDesignCriterion(getDErrorSetup(1), 1, 2, x, draws, R);
      const points = new Float64Array(R);
      fillUniformDraws({ type: 'halton', count: R, dimensions: 1, seed: 7 }, 0, 1, points);
      const bound = getKoksmaHlawkaBound(sigma, points);
      expect(Math.abs(value - exact)).toBeLessThanOrEqual(bound);
      // The bound must be informative, not a blanket pass: under 20 % of the value.
      if (informative) expect(bound).toBeLessThan(0.2 * exact);
    },
  );
});
