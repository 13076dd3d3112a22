import { describe, expect, it } from 'vitest';
import { simulateShares } from '../../../../shared/engine/shares/simulate-shares';
import type { ShareSimulationInput } from '../../../../shared/engine/shares/share-input';

const valid: ShareSimulationInput = {
  respondents: 2,
  coefficients: 1,
  betas: Float64Array.from([1, 2]),
  alternativeCount: 2,
  alternatives: Float64Array.from([0, 1]),
};

describe('simulateShares with invalid arguments', () => {
  it.each([
    [{ respondents: 0 }, /respondents/],
    [{ coefficients: 1.5 }, /coefficients/],
    [{ alternativeCount: 1, alternatives: Float64Array.from([0]) }, /at least 2/],
    [{ betas: Float64Array.from([1]) }, /betas must hold/],
    [{ alternatives: Float64Array.from([0, 1, 2]) }, /alternatives must hold/],
    [{ betas: Float64Array.from([1, Number.NaN]) }, /finite/],
    [{ drawsPerRespondent: 0 }, /drawsPerRespondent/],
    [
      {
        drawsPerRespondent: 2,
        betas: Float64Array.from([1, 2, 3, 4]),
        drawWeights: Float64Array.from([0.5, 0.6, 0.5, 0.5]),
      },
      /sum to 1/,
    ],
    [{ respondentWeights: Float64Array.from([0, 0]) }, /positive sum/],
    [{ respondentWeights: Float64Array.from([1]) }, /one value per respondent/],
    [{ groups: Int32Array.from([0, 1]) }, /groupCount/],
    [{ groups: Int32Array.from([0, 2]), groupCount: 2 }, /outside/],
    [{ groupCount: 2 }, /needs groups/],
  ] as [Partial<ShareSimulationInput>, RegExp][])('rejects %o', (patch, message) => {
    expect(() => simulateShares({ ...valid, ...patch })).toThrow(message);
  });
});
