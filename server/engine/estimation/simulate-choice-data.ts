/**
 * A simulated panel ready to estimate, for recovery tests and benchmarks: the choices
 * simulatePanelChoices draws from known coefficients, the choice data built from them (`built`,
 * and its `data`), and the model that names those coefficients with their true distributions.
 */
import { buildChoiceData } from './build-choice-data';
import type { CoefficientSpec } from './mixed-logit-layout';
import {
  simulatePanelChoices,
  type SimulatePanelChoicesParams,
  type TrueCoefficient,
} from './simulate-panel-choices';

export function simulateChoiceData(params: SimulatePanelChoicesParams) {
  const sim = simulatePanelChoices(params);
  const built = buildChoiceData(sim.columns, sim.rows);
  const coefficients: CoefficientSpec[] = params.coefficients.map(({ name, distribution }) => ({
    name,
    distribution,
  }));
  return { sim, built, data: built.data, coefficients };
}

/**
 * K normal coefficients x1…xK, alternately positive and negative and growing with k
 * (location `even + step·k` or `odd − step·k`, spread `spread + spreadStep·k`): the
 * estimation benchmarks' population.
 */
export function alternatingNormals(
  K: number,
  p: { even: number; odd: number; step: number; spread: number; spreadStep: number },
) {
  return Array.from({ length: K }, (_, k) => ({
    name: `x${k + 1}`,
    distribution: 'normal' as const,
    location: k % 2 === 0 ? p.even + p.step * k : p.odd - p.step * k,
    spread: p.spread + p.spreadStep * k,
  }));
}

/**
 * The coefficients of the recovery tests' simulated good, which each test combines and seeds
 * as it needs: a normal quality taste N(1, 0.8²), a fixed comfort taste of 0.5, and a price
 * drawn from the levels 0–3 with a fixed or a negative-lognormal coefficient (location −0.5,
 * the mean of ln |β|, and the test's spread).
 */
export const normalQuality: TrueCoefficient = {
  name: 'quality',
  distribution: 'normal',
  location: 1.0,
  spread: 0.8,
};
export const fixedComfort: TrueCoefficient = {
  name: 'comfort',
  distribution: 'fixed',
  location: 0.5,
};
export const negLognormalPrice = (spread: number): TrueCoefficient => ({
  name: 'price',
  distribution: 'neg_lognormal',
  location: -0.5,
  spread,
  levels: [0, 1, 2, 3],
});
export const fixedPrice = (location: number, name = 'price'): TrueCoefficient => ({
  name,
  distribution: 'fixed',
  location,
  levels: [0, 1, 2, 3],
});
