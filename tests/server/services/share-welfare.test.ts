/**
 * Welfare of a Shares scenario for an MNL run: the log-sum formula at the estimates (hand
 * computation as in tests/shared/engine/shares/welfare.test.ts) and a Krinsky & Robb (1986)
 * interval from the covariance, which for a small covariance agrees with the delta method.
 */
import { describe, expect, it } from 'vitest';
import { computeShareWelfare } from '../../../server/services/share-welfare';
import type { RunContext } from '../../../server/services/tastes/run-context';

const ctx = (overrides: object = {}) =>
  ({
    run: { model: 'mnl' },
    spec: {
      model: 'mnl',
      space: 'preference',
      cost: 'cost',
      coefficients: [{ name: 'quality' }, { name: 'cost' }],
    },
    definition: {
      fixedAlternative: { label: 'Keep the current service' },
      attributes: [{ name: 'Monthly bill increase', unit: '€', isCost: true }],
    },
    results: {
      respondents: 200,
      covariance: {
        names: ['quality', 'cost'],
        used: 'robust',
        robust: [
          [0.0004, 0],
          [0, 0.0001],
        ],
      },
    },
    ...overrides,
  }) as unknown as RunContext;

// Alternatives A (quality 1, cost 0), B (quality 1, cost 1), status quo (0, 0).
const scenario = {
  rows: Float64Array.from([1, 0, 1, 1, 0, 0]),
  alternativeCount: 3,
  baseline: 'Keep the current service',
  method: 'point_estimates' as const,
  betas: Float64Array.from([1, -0.5]),
  respondents: 1,
  vectorsPerRespondent: 1,
};

describe('computeShareWelfare (MNL)', () => {
  it('gives the log-sum CV at the estimates with a Krinsky–Robb interval', () => {
    const { welfare, welfareNote } = computeShareWelfare(ctx(), scenario);
    expect(welfareNote).toBeNull();
    expect(welfare).toMatchObject({
      baseline: 'Keep the current service',
      money: 'Monthly bill increase',
      unit: '€',
      mean: expect.closeTo(3.360539, 6),
      interval: 'krinsky_robb',
      respondents: 200,
    });
    // Delta method by hand (Greene 2018 §4.6): CV = L/α with L = ln Σ e^V, α = −β_c;
    // ∂CV/∂β_q = (P_A + P_B)/α and ∂CV/∂β_c = P_B/α + L/α², at β = (1, −0.5) with
    // P = (e, e^0.5, 1)/5.367003.
    const S = Math.E + Math.exp(0.5) + 1;
    const [pA, pB] = [Math.E / S, Math.exp(0.5) / S];
    const L = Math.log(S);
    const gq = (pA + pB) / 0.5;
    const gc = pB / 0.5 + L / 0.25;
    const se = Math.sqrt(gq * gq * 0.0004 + gc * gc * 0.0001);
    // Monte Carlo error of a 2.5 % percentile from 2000 draws: √(p(1−p)/n)/φ(1.96) ≈ 0.06·se
    // (asymptotic variance of a sample quantile, Serfling 1980 §2.3); the skew of 1/α adds
    // about 0.02·se here. Bound: 0.15·se.
    expect(Math.abs(welfare!.lower! - (3.360539 - 1.96 * se))).toBeLessThan(0.15 * se);
    expect(Math.abs(welfare!.upper! - (3.360539 + 1.96 * se))).toBeLessThan(0.15 * se);
  });

  it('says why when there is no status quo, no cost or a WTP-space run', () => {
    expect(computeShareWelfare(ctx(), { ...scenario, baseline: null }).welfareNote).toMatch(
      /^Include “Keep the current service”/,
    );
    const spec = { ...ctx().spec };
    expect(
      computeShareWelfare(ctx({ spec: { ...spec, cost: undefined } }), scenario).welfareNote,
    ).toMatch(/no cost coefficient/);
    expect(
      computeShareWelfare(ctx({ spec: { ...spec, space: 'wtp' } }), scenario).welfareNote,
    ).toMatch(/WTP space/);
    expect(
      computeShareWelfare(ctx(), { ...scenario, betas: Float64Array.from([1, 0.2]) }).welfareNote,
    ).toMatch(/not negative/);
  });

  it('weights a latent-class respondent’s class values by their class probabilities', () => {
    // Class 1: β = (1, −0.5), CV = 3.360539; class 2: β = (0.5, −0.25), CV = 5.477352 (hand
    // computations in tests/shared/engine/shares/welfare.test.ts). Respondent 1: h = (0.8,
    // 0.2) → 3.783901; respondent 2: h = (0.1, 0.9) → 5.265671; average 4.524786.
    const classes = [1, -0.5, 0.5, -0.25];
    const { welfare } = computeShareWelfare(ctx({ run: { model: 'latent_class' } }), {
      ...scenario,
      method: 'class_weighted',
      betas: Float64Array.from([...classes, ...classes]),
      respondents: 2,
      vectorsPerRespondent: 2,
      weights: Float64Array.from([0.8, 0.2, 0.1, 0.9]),
    });
    expect(welfare).toMatchObject({
      mean: expect.closeTo(
        (0.8 * 3.360539 + 0.2 * 5.477352 + 0.1 * 3.360539 + 0.9 * 5.477352) / 2,
        5,
      ),
      interval: 'respondent_resampling',
      respondents: 2,
    });
  });

  it('adds a mixed logit’s population figure with an interval from the estimates’ covariance', () => {
    // Spreads of zero make the population one taste vector, so the population mean is the
    // MNL value above, 3.360539 (log-sum formula by hand).
    const mixed = ctx({
      run: { model: 'mixed' },
      spec: {
        model: 'mixed',
        space: 'preference',
        cost: 'cost',
        correlated: false,
        draws: { type: 'halton', count: 500, seed: 11 },
        coefficients: [
          { name: 'quality', distribution: 'normal' },
          { name: 'cost', distribution: 'neg_lognormal' },
        ],
      },
      results: {
        respondents: 200,
        estimates: [
          { name: 'quality.mean', estimate: 1 },
          { name: 'cost.mean', estimate: Math.log(0.5) },
          { name: 'quality.sd', estimate: 0 },
          { name: 'cost.sd', estimate: 0 },
        ],
        covariance: {
          names: ['quality.mean', 'cost.mean', 'quality.sd', 'cost.sd'],
          used: 'robust',
          robust: [
            [0.0004, 0, 0, 0],
            [0, 0.0004, 0, 0],
            [0, 0, 0.0001, 0],
            [0, 0, 0, 0.0001],
          ],
        },
      },
    });
    const { welfare } = computeShareWelfare(mixed, {
      ...scenario,
      method: 'conditional_means',
      betas: Float64Array.from([1, -0.5, 1, -0.5]),
      respondents: 2,
    });
    expect(welfare!.mean).toBeCloseTo(3.360539, 5);
    expect(welfare!.interval).toBe('respondent_resampling');
    expect(welfare!.population!.mean).toBeCloseTo(3.360539, 5);
    expect(welfare!.population!.lower!).toBeLessThan(3.360539);
    expect(welfare!.population!.upper!).toBeGreaterThan(3.360539);
    expect(welfare!.populationNote).toBeNull();
    // A normal cost has no population mean of 1/β_cost: the figure is withheld with the reason.
    const normalCost = ctx({
      ...mixed,
      spec: {
        ...mixed.spec,
        coefficients: [
          { name: 'quality', distribution: 'normal' },
          { name: 'cost', distribution: 'normal' },
        ],
      },
      results: {
        ...mixed.results,
        estimates: [
          { name: 'quality.mean', estimate: 1 },
          { name: 'cost.mean', estimate: -0.5 },
          { name: 'quality.sd', estimate: 0.3 },
          { name: 'cost.sd', estimate: 0.1 },
        ],
      },
    });
    const withheld = computeShareWelfare(normalCost, {
      ...scenario,
      method: 'conditional_means',
      betas: Float64Array.from([1, -0.5]),
    }).welfare!;
    expect(withheld.population).toBeNull();
    expect(withheld.populationNote).toMatch(/reaches zero in the population/);
  });
});
