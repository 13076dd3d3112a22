/**
 * Hit rate of a mixed logit: a task counts as a hit when its chosen alternative has the
 * highest unconditional simulated probability (1/R) Σ_r P_nj(β_r) (ties split evenly);
 * common practice, no source.
 */
import type { DrawsSpec } from '../draws/uniform-draws';
import { getMaxTaskRows, type ChoiceData } from './choice-data';
import { createMixedLogitKernel } from './mixed-logit-kernel';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { createStandardVariates } from './standard-variates';

const CHUNK = 64;

/** Hit rate of the mixed logit at θ on `data` with the given draws; NaN without tasks. */
export function computeMixedHitRate(
  data: ChoiceData,
  layout: MixedLogitLayout,
  theta: Float64Array,
  draws: Omit<DrawsSpec, 'dimensions'>,
): number {
  const N = data.taskStart.length - 1;
  const R = draws.count;
  const { K } = layout;
  const Kd = data.columns.length;
  const maxRows = getMaxTaskRows(data);
  const betas = new Float64Array(K * R);
  const weights = new Float64Array(R);
  const e = new Float64Array(maxRows);
  const prob = new Float64Array(maxRows + 1); // last slot: the chosen alternative
  let hits = 0;
  let tasks = 0;
  for (let first = 0; first < N; first += CHUNK) {
    const count = Math.min(CHUNK, N - first);
    const kernel = createMixedLogitKernel(
      data,
      layout,
      createStandardVariates(layout, draws, first, count),
      R,
      first,
      count,
    );
    for (let n = 0; n < count; n++) {
      kernel.simulateRespondent(n, theta, betas, weights);
      for (let t = data.taskStart[first + n]; t < data.taskStart[first + n + 1]; t++) {
        const row0 = data.diffStart[t];
        const rows = data.diffStart[t + 1] - row0;
        prob.fill(0);
        for (let r = 0; r < R; r++) {
          let den = 1;
          for (let j = 0; j < rows; j++) {
            let v = 0;
            for (let k = 0; k < K; k++)
              v += data.diffs[(row0 + j) * Kd + layout.column[k]] * betas[k * R + r];
            den += e[j] = Math.exp(Math.min(v, 700));
          }
          prob[maxRows] += 1 / den;
          for (let j = 0; j < rows; j++) prob[j] += e[j] / den;
        }
        let best = prob[maxRows];
        for (let j = 0; j < rows; j++) best = Math.max(best, prob[j]);
        const near = (p: number) => p >= best * (1 - 1e-12);
        if (near(prob[maxRows])) {
          let ties = 1;
          for (let j = 0; j < rows; j++) if (near(prob[j])) ties++;
          hits += 1 / ties;
        }
        tasks++;
      }
    }
  }
  return tasks === 0 ? NaN : hits / tasks;
}
