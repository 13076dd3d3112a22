/**
 * The share model the browser recomputes from and the server exports with: scenario coding,
 * point shares against the logit closed form exp(V_j)/Σ_i exp(V_i) (Train 2009, eq. 3.6),
 * intervals of both kinds, and demand curves.
 */
import { describe, expect, it } from 'vitest';
import { makeDemoDefinition } from '../../../../scripts/lib/study-factory/definition';
import type { ShareModel } from '../../../../shared/schemas/shares';
import { ScenarioError } from '../../../../shared/engine/shares/code-scenario';
import {
  computeScenarioShares,
  prepareShareModel,
} from '../../../../shared/engine/shares/share-model';
import { sweepDemandCurve } from '../../../../shared/engine/shares/demand-curve';

/** The demo study's bill and river (the status quo at €0 and a poor river). */
const definition = makeDemoDefinition({ only: ['bill', 'river'], excludedCombinations: [] });

const coefficients = [
  { name: 'bill', key: 'attr:bill', lognormal: true },
  { name: 'fair', key: 'attr:river:river-fair', lognormal: false },
  { name: 'good', key: 'attr:river:river-good', lognormal: false },
  { name: 'sq', key: 'asc:fixed', lognormal: false },
];

const mnl: ShareModel = {
  runId: 'r',
  model: 'mnl',
  method: 'point_estimates',
  definition,
  coefficients,
  respondents: 1,
  vectors: 1,
  betas: [-0.12, 0.5, 0.9, 0.3],
  weights: null,
  sds: null,
  // Diagonal covariance with SDs 0.01, 0.1, 0.1, 0.1.
  choleskyLower: [0.01, 0, 0, 0, 0, 0.1, 0, 0, 0, 0, 0.1, 0, 0, 0, 0, 0.1],
  interval: 'parameter',
  intervalNote: null,
  seed: 1,
  sampleRespondents: 400,
};

const scenario = {
  alternatives: [
    { name: 'A', alternative: 0, levels: { bill: 'bill-6', river: 'river-good' } },
    { name: 'B', alternative: 0, levels: { bill: 'bill-3', river: 'river-fair' } },
  ],
  includeFixed: true,
};

describe('computeScenarioShares', () => {
  it('MNL: point shares equal the closed form and sit inside their Krinsky–Robb interval', () => {
    const r = computeScenarioShares(prepareShareModel(mnl), scenario);
    const v = [-0.12 * 6 + 0.9, -0.12 * 3 + 0.5, 0.3];
    const e = v.map(Math.exp);
    const sum = e[0] + e[1] + e[2];
    r.shares.forEach((s, j) => expect(s).toBeCloseTo(e[j] / sum, 14));
    expect(r.shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    expect(r.interval).toBe('parameter');
    r.shares.forEach((s, j) => {
      expect(r.lower![j]).toBeLessThan(s);
      expect(r.upper![j]).toBeGreaterThan(s);
    });
    expect(r.names).toEqual(['A', 'B', 'Keep the current service']);
  });

  it('individual-level: the share is the mean over conditional draws, inside its interval', () => {
    const model: ShareModel = {
      ...mnl,
      model: 'mixed',
      method: 'conditional_means',
      respondents: 2,
      betas: [-0.1, 0.4, 0.8, 0.2, -0.3, 0.6, 1.2, 0.5],
      sds: [0.02, 0.2, 0.3, 0.1, 0.05, 0.2, 0.3, 0.1],
      choleskyLower: null,
      interval: 'conditional',
    };
    const r = computeScenarioShares(prepareShareModel(model), scenario);
    expect(r.interval).toBe('conditional');
    expect(r.shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    r.shares.forEach((s, j) => {
      expect(r.lower![j]).toBeLessThanOrEqual(s);
      expect(r.upper![j]).toBeGreaterThanOrEqual(s);
      // Close to, but not the same as, the shares at the conditional means.
      expect(Math.abs(s - r.pointShares[j])).toBeLessThan(0.05);
    });
  });

  it('refuses a scenario that misses a level, naming the field', () => {
    const bad = {
      ...scenario,
      alternatives: [
        scenario.alternatives[0],
        { name: 'B', alternative: 0, levels: { bill: 'bill-3' } },
      ],
    };
    expect(() => computeScenarioShares(prepareShareModel(mnl), bad)).toThrow(ScenarioError);
    try {
      computeScenarioShares(prepareShareModel(mnl), bad);
    } catch (e) {
      expect((e as ScenarioError).path).toBe('alternatives.1.levels.river');
    }
  });
});

describe('sweepDemandCurve', () => {
  const p = prepareShareModel(mnl);

  it('sweeps a linear cost between its lowest and highest level, falling with the price', () => {
    const curve = sweepDemandCurve(p, scenario, {
      alternative: 0,
      attributeId: 'bill',
      points: 16,
    });
    expect(curve.scale).toBe('linear');
    expect(curve.points.map((x) => x.value)).toEqual(Array.from({ length: 16 }, (_, i) => i));
    for (let i = 1; i < curve.points.length; i++)
      expect(curve.points[i].share).toBeLessThan(curve.points[i - 1].share);
    // At a level's own value the curve passes through the scenario's share (same coding).
    const atSix = computeScenarioShares(p, scenario).shares[0];
    expect(curve.points[6].share).toBeCloseTo(atSix, 14);
    // Closed form at €0 instead of €6.
    const e = [Math.exp(0.9), Math.exp(-0.36 + 0.5), Math.exp(0.3)];
    expect(curve.points[0].share).toBeCloseTo(e[0] / (e[0] + e[1] + e[2]), 14);
    for (const x of curve.points) {
      expect(x.lower!).toBeLessThan(x.share);
      expect(x.upper!).toBeGreaterThan(x.share);
    }
  });

  it('sweeps a categorical attribute over its levels', () => {
    const curve = sweepDemandCurve(p, scenario, { alternative: 1, attributeId: 'river' });
    expect(curve.scale).toBe('levels');
    expect(curve.points.map((x) => x.levelId)).toEqual(['river-poor', 'river-fair', 'river-good']);
    expect(curve.points[1].share).toBeCloseTo(computeScenarioShares(p, scenario).shares[1], 14);
  });

  it('refuses an unknown attribute or alternative', () => {
    expect(() => sweepDemandCurve(p, scenario, { alternative: 0, attributeId: 'nope' })).toThrow(
      ScenarioError,
    );
    expect(() => sweepDemandCurve(p, scenario, { alternative: 5, attributeId: 'bill' })).toThrow(
      /alternatives/,
    );
  });
});
