import { describe, expect, it } from 'vitest';
import { estimateSecondsLeft } from '../../../server/engine/estimation/time-left';

const base = {
  iteration: 10,
  maxIterations: 300,
  gradientNorm: 1,
  initialGradientNorm: 1e4,
  tolerance: 1e-3,
  secondsPerIteration: 2,
  secondsPerEvaluation: 1.5,
  evaluationsAfter: 4,
  startsLeft: 0,
};

describe('estimateSecondsLeft (closed-form checks of time-left.ts)', () => {
  it('extrapolates the log-rate of the gradient norm, then adds the evaluations after', () => {
    // ln(1e4)/10 per iteration; ln(1/1e-3) to go → 7.5 iterations × 2 s + 4 × 1.5 s = 21 s.
    expect(estimateSecondsLeft(base)).toBeCloseTo(21, 10);
  });

  it('caps the iterations at the limit, counts further starts, and is only the tail once converged', () => {
    expect(estimateSecondsLeft({ ...base, initialGradientNorm: 1 })).toBeCloseTo(290 * 2 + 6, 10);
    expect(estimateSecondsLeft({ ...base, startsLeft: 1 })).toBeCloseTo(15 + 17.5 * 2 + 6, 10);
    expect(estimateSecondsLeft({ ...base, gradientNorm: 1e-4 })).toBeCloseTo(6, 10);
  });
});
