/**
 * Which coefficients the share simulation averages over, per model family, checked against the
 * closed-form logit: for a latent class respondent P_j = Σ_c h_c exp(x_j β_c) / Σ_i exp(x_i β_c)
 * (the class-mixture probability, Greene & Hensher 2003, §4), not the logit at Σ_c h_c β_c.
 */
import { describe, expect, it } from 'vitest';
import { getShareBetas } from '../../../server/services/shares/share-betas';
import { simulateShares } from '../../../shared/engine/shares/simulate-shares';
import type { RunContext } from '../../../server/services/tastes/run-context';

const names = ['price', 'quality'];
// Two alternatives, coded (price, quality).
const alternatives = Float64Array.from([1, 0, 2, 1]);

const logit2 = (b: number[]) => {
  const v = [b[0] * 1 + b[1] * 0, b[0] * 2 + b[1] * 1];
  const e = v.map(Math.exp);
  return e.map((x) => x / (e[0] + e[1]));
};

const ctxOf = (model: string, extra: Partial<RunContext['results']> = {}) =>
  ({
    run: { model },
    results: {
      estimates: [
        { name: 'price', estimate: -0.5 },
        { name: 'quality', estimate: 1 },
      ],
      ...extra,
    },
  }) as unknown as Pick<RunContext, 'run' | 'results'>;

const est = (price: number, quality: number) => [
  { name: 'price', estimate: price, se: null },
  { name: 'quality', estimate: quality, se: null },
];

describe('getShareBetas', () => {
  it('latent class: class probabilities weight the class logit probabilities', () => {
    const ctx = ctxOf('latent_class', {
      classes: [
        { class: 1, share: 0.6, shareSe: null, estimates: est(-1, 0.5), wtp: null, membership: [] },
        { class: 2, share: 0.4, shareSe: null, estimates: est(0.2, 2), wtp: null, membership: [] },
      ],
    });
    const profiles = [
      { mean: {}, extra: { classProbabilities: [0.3, 0.7] } },
      { mean: {}, extra: { classProbabilities: [0.9, 0.1] } },
    ];
    const b = getShareBetas(ctx, profiles, names);
    expect(b).toMatchObject({ method: 'class_weighted', N: 2, D: 2 });
    const out = simulateShares({
      respondents: b.N,
      coefficients: 2,
      betas: b.betas,
      drawsPerRespondent: b.D,
      drawWeights: b.drawWeights,
      alternativeCount: 2,
      alternatives,
    });
    const [p1, p2] = [logit2([-1, 0.5]), logit2([0.2, 2])];
    const r1 = 0.3 * p1[1] + 0.7 * p2[1];
    const r2 = 0.9 * p1[1] + 0.1 * p2[1];
    expect(out.probabilities[1]).toBeCloseTo(r1, 14);
    expect(out.probabilities[3]).toBeCloseTo(r2, 14);
    expect(out.shares[1]).toBeCloseTo((r1 + r2) / 2, 14);
    // Not the logit at the probability-weighted mean coefficients.
    expect(
      Math.abs(out.probabilities[1] - logit2([0.3 * -1 + 0.7 * 0.2, 0.3 * 0.5 + 0.7 * 2])[1]),
    ).toBeGreaterThan(0.01);
  });

  it('HB: each respondent’s posterior means, one vector each', () => {
    const b = getShareBetas(
      ctxOf('hb'),
      [
        { mean: { price: -0.2, quality: 1.5 }, extra: { lower: {}, upper: {} } },
        { mean: { price: -2, quality: 0.1 }, extra: null },
      ],
      names,
    );
    expect(b).toMatchObject({ method: 'posterior_means', N: 2, D: 1 });
    expect(Array.from(b.betas)).toEqual([-0.2, 1.5, -2, 0.1]);
  });

  it('mixed logit: conditional means; MNL: the point estimates', () => {
    expect(
      getShareBetas(ctxOf('mixed'), [{ mean: { price: 1, quality: 2 }, extra: null }], names),
    ).toMatchObject({ method: 'conditional_means', N: 1 });
    const mnl = getShareBetas(ctxOf('mnl'), [], names);
    expect(mnl).toMatchObject({ method: 'point_estimates', N: 1, D: 1 });
    expect(Array.from(mnl.betas)).toEqual([-0.5, 1]);
  });
});
