import { describe, expect, it } from 'vitest';
import { computeMixedHitRate } from '../../../server/engine/estimation/mixed-logit-hit-rate';
import { createMixedLogitLayout } from '../../../server/engine/estimation/mixed-logit-layout';
import { computeMnlHitRate } from '../../../server/engine/estimation/mnl-hit-rate';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';

describe('computeMixedHitRate', () => {
  it('equals the MNL hit rate when the spread is negligible (the mixed logit collapses to the MNL)', () => {
    const { data, coefficients } = simulateChoiceData({
      respondents: 40,
      tasks: 5,
      alternatives: 3,
      seed: 9,
      coefficients: [
        { name: 'a', distribution: 'normal', location: 0.7, spread: 0.5 },
        { name: 'b', distribution: 'fixed', location: -0.4 },
      ],
    });
    const layout = createMixedLogitLayout(data, coefficients, false);
    const mixed = computeMixedHitRate(data, layout, Float64Array.from([0.7, -0.4, 1e-9]), {
      type: 'halton',
      count: 20,
      seed: 1,
    });
    expect(mixed).toBeCloseTo(computeMnlHitRate(data, Float64Array.from([0.7, -0.4])), 12);
    expect(mixed).toBeGreaterThan(1 / 3);
  });
});
