/**
 * A simulated panel ready to estimate, for recovery tests and benchmarks: the choices
 * simulatePanelChoices draws from known coefficients, the choice data built from them (`built`,
 * and its `data`), and the model that names those coefficients with their true distributions.
 */
import { buildChoiceData } from './build-choice-data';
import type { CoefficientSpec } from './mixed-logit-layout';
import { simulatePanelChoices, type SimulatePanelChoicesParams } from './simulate-panel-choices';

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
