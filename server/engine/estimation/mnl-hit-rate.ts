/**
 * Hit rate of a logit model: share of tasks whose chosen alternative has the highest
 * predicted utility (ties split evenly), common practice, no source.
 */
import type { ChoiceData } from './choice-data';

/** Hit rate at fixed coefficients β (length K = data columns); NaN for data without tasks. */
export function computeMnlHitRate(data: ChoiceData, beta: Float64Array): number {
  const K = data.columns.length;
  const T = data.diffStart.length - 1;
  let hits = 0;
  for (let t = 0; t < T; t++) {
    let best = 0;
    let ties = 1;
    for (let row = data.diffStart[t]; row < data.diffStart[t + 1]; row++) {
      let v = 0;
      for (let k = 0; k < K; k++) v += beta[k] * data.diffs[row * K + k];
      if (v > best + 1e-12) {
        best = v;
        ties = 0;
      } else if (Math.abs(v - best) <= 1e-12 && best === 0) ties++;
    }
    if (ties > 0 && best === 0) hits += 1 / ties;
  }
  return T === 0 ? NaN : hits / T;
}
