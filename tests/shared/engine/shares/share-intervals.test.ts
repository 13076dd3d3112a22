/**
 * Share intervals and substitution patterns. Sources beside each check:
 * - logit shares exp(V_j)/Σ_i exp(V_i) (McFadden 1974; Train 2009, *Discrete Choice Methods
 *   with Simulation*, 2nd ed., eq. 3.6), closed form;
 * - IIA of MNL and its relaxation by mixed logit: the red-bus/blue-bus example (Train 2009,
 *   §3.3.1) and mixed logit's substitution patterns (Train 2009, ch. 6; section numbers from
 *   memory): a copy of an alternative takes proportionally from all others under MNL and more
 *   from its twin under taste variation;
 * - Krinsky & Robb (1986): with θ ~ N(θ̂, Σ) and one coefficient, the share of a binary logit
 *   is a monotone function of θ, so its percentile interval is the logit of θ̂ ± 1.96 σ
 *   (closed form up to the Monte Carlo error of the 2.5 % and 97.5 % quantiles).
 */
import { describe, expect, it } from 'vitest';
import {
  drawClassVectors,
  drawConditionalVectors,
  drawParameterVectors,
} from '../../../../shared/engine/shares/share-draws';
import { simulateShareIntervals } from '../../../../shared/engine/shares/share-intervals';
import { simulateShares } from '../../../../shared/engine/shares/simulate-shares';

const f64 = (xs: number[]) => Float64Array.from(xs);
const logistic = (v: number) => 1 / (1 + Math.exp(-v));

describe('share intervals', () => {
  it('every draw’s shares sum to 1, as do the means (shares are probabilities)', () => {
    const draws = drawConditionalVectors(
      {
        respondents: 3,
        coefficients: 2,
        means: f64([1, -0.5, 0.2, -1, -0.4, -2]),
        sds: f64([0.5, 0.1, 1, 0.3, 0.2, 0.6]),
        lognormal: Uint8Array.from([0, 1]),
      },
      50,
      7,
    );
    const r = simulateShareIntervals(draws, 3, f64([1, 2, 0, 5, 1, 0]));
    for (let d = 0; d < 50; d++) {
      const s = r.drawShares.subarray(d * 3, d * 3 + 3);
      expect(s[0] + s[1] + s[2]).toBeCloseTo(1, 14);
    }
    expect(r.mean.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    for (let j = 0; j < 3; j++) {
      expect(r.lower[j]).toBeLessThanOrEqual(r.mean[j]);
      expect(r.upper[j]).toBeGreaterThanOrEqual(r.mean[j]);
    }
  });

  it('Krinsky–Robb interval of a binary logit share is the logit of θ̂ ± 1.96σ', () => {
    // V = θ·x with x = (0, 1): P₂ = logistic(θ), monotone in θ, so its quantiles are the
    // logistic of θ's quantiles (closed form). 20,000 draws: the 2.5 % quantile of a normal
    // has Monte Carlo SD √(q(1−q)/R)/φ(1.96) ≈ 0.019σ, so 0.06σ is three of those.
    const theta = 0.4;
    const sigma = 0.3;
    const d = drawParameterVectors(f64([theta]), f64([sigma]), 20000, 11);
    const r = simulateShareIntervals(d, 2, f64([0, 1]));
    const tol = logistic(theta) * (1 - logistic(theta)) * 0.06 * sigma;
    expect(Math.abs(r.lower[1] - logistic(theta - 1.959964 * sigma))).toBeLessThan(tol);
    expect(Math.abs(r.upper[1] - logistic(theta + 1.959964 * sigma))).toBeLessThan(tol);
    expect(r.lower[0] + r.upper[1]).toBeCloseTo(1, 12);
  });

  it('draws are seeded: the same seed gives the same interval, another seed another', () => {
    const m = {
      respondents: 2,
      coefficients: 1,
      means: f64([0.5, -0.5]),
      sds: f64([1, 1]),
      lognormal: Uint8Array.from([0]),
    };
    const a = simulateShareIntervals(drawConditionalVectors(m, 100, 3), 2, f64([0, 1]));
    const b = simulateShareIntervals(drawConditionalVectors(m, 100, 3), 2, f64([0, 1]));
    const c = simulateShareIntervals(drawConditionalVectors(m, 100, 4), 2, f64([0, 1]));
    expect(Array.from(a.lower)).toEqual(Array.from(b.lower));
    expect(a.lower[1]).not.toBe(c.lower[1]);
  });

  it('lognormal conditional draws keep the sign and match the mean and SD', () => {
    // Two-moment lognormal: E = −2, SD = 0.5 (σ² = ln(1 + sd²/mean²), μ = ln|mean| − σ²/2).
    const d = drawConditionalVectors(
      {
        respondents: 1,
        coefficients: 1,
        means: f64([-2]),
        sds: f64([0.5]),
        lognormal: Uint8Array.from([1]),
      },
      40000,
      5,
    );
    let sum = 0;
    let sq = 0;
    let positive = 0;
    for (const b of d.betas) {
      if (b >= 0) positive++;
      sum += b;
      sq += b * b;
    }
    expect(positive).toBe(0);
    const mean = sum / 40000;
    // Monte Carlo SD of the mean: 0.5/√40000 = 0.0025; four of those.
    expect(mean).toBeCloseTo(-2, 1);
    expect(Math.abs(mean + 2)).toBeLessThan(0.01);
    expect(Math.sqrt(sq / 40000 - mean * mean)).toBeCloseTo(0.5, 1);
  });

  it('latent class draws pick class c with the respondent’s probability h_nc', () => {
    const d = drawClassVectors(f64([1, -1]), f64([0.25, 0.75]), 1, 2, 40000, 9);
    const first = d.betas.filter((b) => b === 1).length / 40000;
    // Binomial SD √(0.25·0.75/40000) ≈ 0.0022; four of those.
    expect(Math.abs(first - 0.25)).toBeLessThan(0.009);
  });
});

describe('substitution when an alternative is duplicated', () => {
  // Alternatives coded on two attributes; respondents' tastes differ strongly (mixed logit
  // style: each respondent their own β). A, B, C, then a copy of A.
  const A = [1, 0];
  const B = [0, 1];
  const C = [0.5, 0.5];
  const withoutCopy = f64([...A, ...B, ...C]);
  const withCopy = f64([...A, ...B, ...C, ...A]);

  it('MNL: the copy takes proportionally from every alternative (IIA, Train 2009 §3.3.1)', () => {
    const beta = f64([0.8, 0.3]);
    const before = simulateShares({
      respondents: 1,
      coefficients: 2,
      betas: beta,
      alternativeCount: 3,
      alternatives: withoutCopy,
    }).shares;
    const after = simulateShares({
      respondents: 1,
      coefficients: 2,
      betas: beta,
      alternativeCount: 4,
      alternatives: withCopy,
    }).shares;
    // Closed form: P_j = exp(V_j)/Σ exp(V_i).
    const v = [0.8, 0.3, 0.55];
    const e = v.map(Math.exp);
    const sum = e[0] + e[1] + e[2];
    before.forEach((s, j) => expect(s).toBeCloseTo(e[j] / sum, 14));
    after.forEach((s, j) => expect(s).toBeCloseTo(e[j === 3 ? 0 : j] / (sum + e[0]), 14));
    // Every original alternative keeps the same fraction of its share: IIA.
    const kept = [0, 1, 2].map((j) => after[j] / before[j]);
    expect(kept[1]).toBeCloseTo(kept[0], 14);
    expect(kept[2]).toBeCloseTo(kept[0], 14);
  });

  it('mixed logit: the copy takes more from its twin than from the others (Train 2009, ch. 6)', () => {
    // Half the respondents love attribute 1 (A), half attribute 2 (B).
    const betas = f64([3, 0, 3, 0.2, 0, 3, 0.2, 3]);
    const sim = (J: number, x: Float64Array) =>
      simulateShares({
        respondents: 4,
        coefficients: 2,
        betas,
        alternativeCount: J,
        alternatives: x,
      }).shares;
    const before = sim(3, withoutCopy);
    const after = sim(4, withCopy);
    const kept = [0, 1, 2].map((j) => after[j] / before[j]);
    // A (the twin) keeps a clearly smaller fraction of its share than B and C.
    expect(kept[0]).toBeLessThan(kept[1] - 0.1);
    expect(kept[0]).toBeLessThan(kept[2] - 0.05);
    // …and the total still sums to 1.
    expect(after.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
  });
});
