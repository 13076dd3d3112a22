/**
 * The share model of an MNL run, whose estimates and covariance are named by data column
 * ("attr:bill") while the specification names coefficients ("monthly_bill"): the model must
 * carry the estimates (not zeros) and the Cholesky factor of their covariance, L·Lᵀ = Σ
 * (Golub & Van Loan, Matrix Computations, 4th ed., §4.2; checked by multiplying back).
 */
import { describe, expect, it } from 'vitest';
import { buildShareModel } from '../../../server/services/shares/share-model';
import type { RunContext } from '../../../server/services/tastes/run-context';

const ctx = {
  run: { id: 'r', model: 'mnl' },
  definition: { attributes: [] },
  spec: {
    model: 'mnl',
    coefficients: [
      { name: 'monthly_bill', column: 'attr:bill' },
      { name: 'river_good', column: 'attr:river:good' },
    ],
  },
  results: {
    respondents: 400,
    population: [],
    estimates: [
      { name: 'attr:bill', estimate: -0.12 },
      { name: 'attr:river:good', estimate: 0.9 },
    ],
    covariance: {
      used: 'classical',
      names: ['attr:bill', 'attr:river:good'],
      classical: [
        [0.0004, 0.0001],
        [0.0001, 0.01],
      ],
    },
  },
} as unknown as RunContext;

describe('buildShareModel', () => {
  it('reads an MNL run’s estimates and covariance under their column names', () => {
    const m = buildShareModel(ctx, []);
    expect(m.method).toBe('point_estimates');
    expect(m.betas).toEqual([-0.12, 0.9]);
    expect(m.interval).toBe('parameter');
    expect(m.sampleRespondents).toBe(400);
    const L = m.choleskyLower!;
    // L·Lᵀ reproduces Σ.
    expect(L[0] * L[0]).toBeCloseTo(0.0004, 15);
    expect(L[2] * L[0]).toBeCloseTo(0.0001, 15);
    expect(L[2] * L[2] + L[3] * L[3]).toBeCloseTo(0.01, 15);
    expect(L[1]).toBe(0);
  });

  it('says why there is no interval when the covariance is missing', () => {
    const m = buildShareModel(
      { ...ctx, results: { ...ctx.results, covariance: undefined } } as unknown as RunContext,
      [],
    );
    expect(m.interval).toBeNull();
    expect(m.intervalNote).toMatch(/no usable covariance/);
  });
});
