/**
 * The rows of a run's parameter table, as the Estimates screen shows them and the estimate
 * files write them: readable name and part, the estimate (spreads as |s|, shared/results/spread.ts),
 * classical and robust SEs, t and two-sided p from the robust SE (classical when there is no
 * robust one), and the 95 % interval estimate ± 1.959964 SE (normal approximation; the 97.5 %
 * point of the standard normal, standard normal tables). HB: posterior mean and SD, no t or p.
 */
import type { RunResult } from '../schemas/run';
import { describeParameter, getLabelOf } from './parameter-labels';
import { isSpreadParameter, showSpread } from './spread';
import { twoSidedP } from './normal-p';

export const Z95 = 1.959964;

export interface ParameterRow {
  name: string;
  label: string;
  part: string | null;
  spread: boolean;
  estimate: number;
  se: number | null;
  robustSe: number | null;
  t: number | null;
  p: number | null;
  lower: number | null;
  upper: number | null;
}

export function getParameterRows(
  results: Pick<RunResult, 'estimates' | 'columns' | 'population' | 'model'>,
): ParameterRow[] {
  const bayes = results.model === 'hb';
  const labelOf = getLabelOf(results);
  const distribution = new Map(results.population.map((m) => [m.name, m.distribution]));
  return results.estimates.map((e) => {
    const se = e.robustSe ?? e.se;
    const spread = isSpreadParameter(e.name);
    const lower = se ? e.estimate - Z95 * se : null;
    const upper = se ? e.estimate + Z95 * se : null;
    const shown = spread
      ? showSpread(e.estimate, lower, upper)
      : { value: e.estimate, lower, upper };
    const t = se && !bayes ? shown.value / se : null;
    const { label, part } = describeParameter(e.name, labelOf, (c) => distribution.get(c));
    return {
      name: e.name,
      label,
      part,
      spread,
      estimate: shown.value,
      se: e.se,
      robustSe: e.robustSe,
      t,
      p: t === null ? null : twoSidedP(t),
      lower: shown.lower,
      upper: shown.upper,
    };
  });
}
