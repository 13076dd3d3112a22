import { describe, expect, it } from 'vitest';
import { simulateShares } from '../../../../shared/engine/shares/simulate-shares';

const f64 = (xs: number[]) => Float64Array.from(xs);

describe('simulateShares', () => {
  it('gives identical alternatives equal shares whatever the tastes (symmetry, closed form)', () => {
    // Three respondents with very different tastes, four copies of one alternative: 1/J each.
    const result = simulateShares({
      respondents: 3,
      coefficients: 2,
      betas: f64([1, -2, -3, 0.5, 10, 4]),
      alternativeCount: 4,
      alternatives: f64([1, 2, 1, 2, 1, 2, 1, 2]),
    });
    for (const s of result.shares) expect(s).toBeCloseTo(0.25, 14);
    for (const p of result.probabilities) expect(p).toBeCloseTo(0.25, 14);
  });

  it('reduces to the MNL formula exp(V_j)/Σ exp(V_i) for a single respondent', () => {
    // V = (0, ln 2, ln 3): shares 1/6, 2/6, 3/6 (McFadden 1974 logit formula, closed form).
    const result = simulateShares({
      respondents: 1,
      coefficients: 1,
      betas: f64([1]),
      alternativeCount: 3,
      alternatives: f64([0, Math.log(2), Math.log(3)]),
    });
    expect(Array.from(result.shares)).toEqual([
      expect.closeTo(1 / 6, 14),
      expect.closeTo(2 / 6, 14),
      expect.closeTo(3 / 6, 14),
    ]);
  });

  it('averages individual probabilities rather than scoring one average person', () => {
    // β₁ = ln 2 gives (1/3, 2/3), β₂ = 0 gives (1/2, 1/2): the average is (5/12, 7/12).
    // The average person β̄ = ln 2 / 2 would get √2/(1+√2) ≈ 0.5858 instead of 7/12 ≈ 0.5833.
    const result = simulateShares({
      respondents: 2,
      coefficients: 1,
      betas: f64([Math.log(2), 0]),
      alternativeCount: 2,
      alternatives: f64([0, 1]),
    });
    expect(result.shares[0]).toBeCloseTo(5 / 12, 14);
    expect(result.shares[1]).toBeCloseTo(7 / 12, 14);
    expect(result.shares[1]).not.toBeCloseTo(Math.SQRT2 / (1 + Math.SQRT2), 3);
  });

  it('weights a respondent’s conditional draws by their weights', () => {
    // Draws ln 2 (weight 1/4) and 0 (weight 3/4): P₂ = ¼·⅔ + ¾·½ = 13/24 (hand computed).
    const result = simulateShares({
      respondents: 1,
      coefficients: 1,
      drawsPerRespondent: 2,
      betas: f64([Math.log(2), 0]),
      drawWeights: f64([0.25, 0.75]),
      alternativeCount: 2,
      alternatives: f64([0, 1]),
    });
    expect(result.shares[1]).toBeCloseTo(13 / 24, 14);
    expect(result.shares[0] + result.shares[1]).toBeCloseTo(1, 14);
  });

  it('splits shares by group and weights respondents', () => {
    const result = simulateShares({
      respondents: 3,
      coefficients: 1,
      betas: f64([Math.log(2), 0, Math.log(3)]),
      alternativeCount: 2,
      alternatives: f64([0, 1]),
      groups: Int32Array.from([0, 1, -1]),
      groupCount: 2,
      respondentWeights: f64([1, 1, 2]),
    });
    expect(Array.from(result.groupCounts)).toEqual([1, 1]);
    expect(result.groupShares[1]).toBeCloseTo(2 / 3, 14);
    expect(result.groupShares[3]).toBeCloseTo(1 / 2, 14);
    // Overall: (1·2/3 + 1·1/2 + 2·3/4) / 4 = (2/3 + 1/2 + 3/2) / 4 = 2/3.
    expect(result.shares[1]).toBeCloseTo(2 / 3, 14);
  });

  it('keeps the IIA ratio exp(V_j − V_i) for one respondent when an alternative is added', () => {
    const two = simulateShares({
      respondents: 1,
      coefficients: 2,
      betas: f64([0.7, -0.3]),
      alternativeCount: 2,
      alternatives: f64([1, 3, 2, 1]),
    });
    const three = simulateShares({
      respondents: 1,
      coefficients: 2,
      betas: f64([0.7, -0.3]),
      alternativeCount: 3,
      alternatives: f64([1, 3, 2, 1, 0, 0]),
    });
    const expected = Math.exp(0.7 * 2 - 0.3 * 1 - (0.7 * 1 - 0.3 * 3));
    expect(two.shares[1] / two.shares[0]).toBeCloseTo(expected, 12);
    expect(three.shares[1] / three.shares[0]).toBeCloseTo(expected, 12);
  });

  it('stays finite with utilities far beyond exp’s range', () => {
    const result = simulateShares({
      respondents: 1,
      coefficients: 1,
      betas: f64([1000]),
      alternativeCount: 2,
      alternatives: f64([1, 2]),
    });
    expect(result.shares[1]).toBe(1);
    expect(result.shares[0]).toBe(0);
  });
});
