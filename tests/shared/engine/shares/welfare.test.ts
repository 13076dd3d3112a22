import { describe, expect, it } from 'vitest';
import {
  computeCompensatingVariation,
  meanOfFinite,
} from '../../../../shared/engine/shares/welfare';

// Two columns: quality (0/1) and cost (money units). Alternatives A (quality 1, cost 0),
// B (quality 1, cost 1) and the status quo (0, 0).
const alternatives = Float64Array.from([1, 0, 1, 1, 0, 0]);

describe('computeCompensatingVariation (log-sum, Train 2009 §3.5 eq. 3.10)', () => {
  it('matches a hand computation of the closed-form MNL case', () => {
    // β = (1, −0.5): V = (1, 0.5, 0), α = 0.5.
    // CV = ln(e¹ + e^0.5 + e⁰)/0.5 = ln(2.718282 + 1.648721 + 1)/0.5 = ln(5.367003)/0.5
    //    = 1.680270/0.5 = 3.360539 (hand computation; e and ln to 7 digits).
    const cv = computeCompensatingVariation({
      respondents: 1,
      coefficients: 2,
      betas: Float64Array.from([1, -0.5]),
      alternativeCount: 3,
      alternatives,
      baseline: 2,
      cost: 1,
    });
    expect(cv[0]).toBeCloseTo(3.360539, 6);
  });

  it('averages per respondent and leaves out a respondent without a money metric', () => {
    // Respondent 2: β = (0.5, −0.25): CV = ln(e^0.5 + e^0.25 + 1)/0.25 = ln(3.932747)/0.25
    // = 5.477352. Respondent 3's cost coefficient is positive: no CV.
    const cv = computeCompensatingVariation({
      respondents: 3,
      coefficients: 2,
      betas: Float64Array.from([1, -0.5, 0.5, -0.25, 1, 0.1]),
      alternativeCount: 3,
      alternatives,
      baseline: 2,
      cost: 1,
    });
    expect(cv[1]).toBeCloseTo(5.477352, 6);
    expect(cv[2]).toBeNaN();
    const m = meanOfFinite(cv);
    expect(m).toEqual({ mean: expect.closeTo((3.360539 + 5.477352) / 2, 6), count: 2, left: 1 });
  });

  it('tends to zero when the scenario only adds alternatives far worse than the status quo', () => {
    // With alternatives far worse than the status quo the log-sum tends to V_sq: CV → 0⁺.
    const cv = computeCompensatingVariation({
      respondents: 1,
      coefficients: 2,
      betas: Float64Array.from([1, -0.5]),
      alternativeCount: 3,
      alternatives: Float64Array.from([0, 200, 0, 300, 0, 0]),
      baseline: 2,
      cost: 1,
    });
    expect(cv[0]).toBeGreaterThanOrEqual(0);
    expect(cv[0]).toBeLessThan(1e-12);
  });

  it('refuses a baseline or cost column outside the scenario', () => {
    const base = {
      respondents: 1,
      coefficients: 2,
      betas: Float64Array.from([1, -0.5]),
      alternativeCount: 3,
      alternatives,
    };
    expect(() => computeCompensatingVariation({ ...base, baseline: 3, cost: 1 })).toThrow(
      /baseline/,
    );
    expect(() => computeCompensatingVariation({ ...base, baseline: 2, cost: 2 })).toThrow(/cost/);
  });
});
