/**
 * LL(C), the constants-only log-likelihood: with the same alternatives in every task it is
 * Σ_j n_j ln(n_j/T), n_j the times alternative j was chosen in T tasks (the market-share model;
 * Ben-Akiva & Lerman 1985 §7.4, from memory). CAIC = −2LL + K(ln n + 1) (Bozdogan 1987,
 * Psychometrika 52:345-370, eq. 40, from memory).
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import {
  computeCaic,
  computeConstantsLoglik,
} from '../../../server/engine/estimation/fit-statistics';

describe('fit statistics', () => {
  it('LL(C) equals Σ n_j ln(n_j/T) when every task shows the same alternatives', () => {
    const choices = [1, 1, 1, 2, 2, 3, 1, 2, 1, 3]; // n = (5, 3, 2), T = 10
    const rows = choices.flatMap((c, t) =>
      [1, 2, 3].map((alt) => ({
        respondent: 1 + (t % 4),
        task: t,
        alt,
        chosen: alt === c ? 1 : 0,
        values: [alt === 2 ? t % 3 : 0],
      })),
    );
    const built = buildChoiceData(['x'], rows);
    const expected = 5 * Math.log(0.5) + 3 * Math.log(0.3) + 2 * Math.log(0.2);
    expect(computeConstantsLoglik(built.constants!)).toBeCloseTo(expected, 10);
  });

  it('CAIC adds K(ln n + 1) to −2LL', () => {
    expect(computeCaic(-100, 3, 50)).toBeCloseTo(200 + 3 * (Math.log(50) + 1), 12);
  });
});
