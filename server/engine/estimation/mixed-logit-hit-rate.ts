/**
 * Hit rate of a mixed logit: a task counts as a hit when its chosen alternative has the
 * highest unconditional simulated probability (1/R) Σ_r P_nj(β_r) (ties split evenly);
 * common practice, no source.
 */
import { DIST_FIXED, type MixedLogitLayout } from './mixed-logit-layout';
import type { ChoiceData } from './choice-data';
import { createMixedLogitKernel } from './mixed-logit-kernel';
import { createStandardVariates } from './standard-variates';
import type { DrawsSpec } from '../draws/uniform-draws';

/** Hit rate of the mixed logit at θ on `data` with the given draws. */
export function computeMixedHitRate(
  data: ChoiceData,
  layout: MixedLogitLayout,
  theta: Float64Array,
  draws: Omit<DrawsSpec, 'dimensions'>,
): number {
  const N = data.taskStart.length - 1;
  const R = draws.count;
  const K = layout.K;
  const Kd = data.columns.length;
  const betas = new Float64Array(K * R);
  const weights = new Float64Array(R);
  let hits = 0;
  let tasks = 0;
  for (let n = 0; n < N; n++) {
    const variates = createStandardVariates(layout, draws, n, 1);
    const kernel = createMixedLogitKernel(data, layout, variates, R, n, 1);
    kernel.simulateRespondent(0, theta, betas, weights);
    for (let t = data.taskStart[n]; t < data.taskStart[n + 1]; t++) {
      const rows = data.diffStart[t + 1] - data.diffStart[t];
      const prob = new Float64Array(rows + 1); // index rows = chosen
      for (let r = 0; r < R; r++) {
        let den = 1;
        const e = new Float64Array(rows);
        for (let j = 0; j < rows; j++) {
          let v = 0;
          const o = (data.diffStart[t] + j) * Kd;
          for (let k = 0; k < K; k++) {
            const beta =
              layout.dist[k] === DIST_FIXED ? theta[layout.meanIndex[k]] : betas[k * R + r];
            v += data.diffs[o + layout.column[k]] * beta;
          }
          den += e[j] = Math.exp(Math.min(v, 700));
        }
        prob[rows] += 1 / den;
        for (let j = 0; j < rows; j++) prob[j] += e[j] / den;
      }
      const best = Math.max(...prob);
      if (prob[rows] >= best * (1 - 1e-12))
        hits += 1 / prob.filter((p) => p >= best * (1 - 1e-12)).length;
      tasks++;
    }
  }
  return tasks === 0 ? NaN : hits / tasks;
}
