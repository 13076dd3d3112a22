/**
 * Fit of an HB run in the terms of the other models, so the comparison view can set them side by
 * side: the simulated panel log-likelihood at the posterior means (μ̄, Σ̄, fixed) — the mixed
 * logit's objective (Train 2009, eq. 6.2) at the Bayes estimates, which by Bernstein-von Mises is
 * close to the mixed logit's maximum in large samples (Train 2009, §12.2) — with population-level
 * hit rates from the same simulated probabilities, and individual-level hit rates from each
 * respondent's posterior mean coefficients (holdout tasks matched by respondent).
 */
import { inverseNormal } from '../draws/inverse-normal';
import { fillUniformDraws, getMaxDrawDimensions } from '../draws/uniform-draws';
import { choleskyDecompose } from '../linalg/cholesky';
import { getMaxTaskRows, type ChoiceData } from '../estimation/choice-data';
import { computeTaskProbabilities, scoreTaskHit } from '../estimation/score-task-hit';
import { buildRespondentDesign } from './respondent-design';
import { createRespondentShiftKernel } from './respondent-shift-kernel';
import type { HbLayout } from './check-hb-options';
import { toBeta } from './individual-step';

export interface HbPopulationFit {
  loglik: number;
  hitRate: number;
  holdoutHitRate: number | null;
}

const DRAWS = 500;

/** Simulated LL and hit rates at (μ̄, Σ̄, fixed) with DRAWS scrambled Halton draws per respondent. */
export function computeHbPopulationFit(
  data: ChoiceData,
  holdout: ChoiceData | null,
  layout: HbLayout,
  population: { mu: Float64Array; sigma: Float64Array; fixed: Float64Array },
  seed: number,
): HbPopulationFit {
  const fit = simulate(data, layout, population, seed);
  return {
    loglik: fit.loglik,
    hitRate: fit.hitRate,
    holdoutHitRate: holdout ? simulate(holdout, layout, population, seed).hitRate : null,
  };
}

function simulate(
  data: ChoiceData,
  layout: HbLayout,
  population: { mu: Float64Array; sigma: Float64Array; fixed: Float64Array },
  seed: number,
): { loglik: number; hitRate: number } {
  const { K, random, fixed, transform } = layout;
  const Kr = random.length;
  const N = data.taskStart.length - 1;
  const L = new Float64Array(Kr * Kr);
  if (!choleskyDecompose(population.sigma, Kr, L)) return { loglik: NaN, hitRate: NaN };
  const type = Kr <= getMaxDrawDimensions('halton') ? 'halton' : 'mlhs';
  const u = new Float64Array(Kr * DRAWS);
  const z = new Float64Array(Kr);
  const ll = new Float64Array(DRAWS);
  // All K columns in coefficient order, utilities from 0: the sums of computeRespondentLoglik.
  const all = Int32Array.from({ length: K }, (_, k) => k);
  const design = buildRespondentDesign(data, { ...layout, random: all, fixed: new Int32Array(0) });
  const kernel = createRespondentShiftKernel(data, design, K, 0, 'likelihood');
  const beta = kernel.delta;
  const { exps, denominators } = kernel;
  // Per respondent: the summed probabilities of each row (non-chosen alternatives) and of each
  // task's chosen alternative over the draws.
  const rowSum = new Float64Array(design.maxRows);
  let maxTasks = 1;
  for (let n = 0; n < N; n++)
    maxTasks = Math.max(maxTasks, data.taskStart[n + 1] - data.taskStart[n]);
  const chosenSum = new Float64Array(maxTasks);
  let total = 0;
  let hits = 0;
  for (let n = 0; n < N; n++) {
    const firstTask = data.taskStart[n];
    const T = data.taskStart[n + 1] - firstTask;
    const first = data.diffStart[firstTask];
    rowSum.fill(0);
    chosenSum.fill(0);
    fillUniformDraws({ type, count: DRAWS, dimensions: Kr, seed }, n, 1, u);
    for (let r = 0; r < DRAWS; r++) {
      for (let f = 0; f < fixed.length; f++) beta[fixed[f]] = population.fixed[f];
      for (let j = 0; j < Kr; j++) z[j] = inverseNormal(u[j * DRAWS + r]);
      for (let i = 0; i < Kr; i++) {
        let a = population.mu[i];
        for (let j = 0; j <= i; j++) a += L[i * Kr + j] * z[j];
        beta[random[i]] = toBeta(transform[random[i]], a);
      }
      ll[r] = kernel.shiftedLoglik(n, false);
      // The same draw's logit probabilities: e^{v_j}/d_t, and 1/d_t for the chosen alternative.
      for (let t = 0; t < T; t++) {
        const d = denominators[t];
        chosenSum[t] += 1 / d;
        for (
          let i = data.diffStart[firstTask + t] - first;
          i < data.diffStart[firstTask + t + 1] - first;
          i++
        )
          rowSum[i] += exps[i] / d;
      }
    }
    let max = -Infinity;
    for (let r = 0; r < DRAWS; r++) max = Math.max(max, ll[r]);
    let sum = 0;
    for (let r = 0; r < DRAWS; r++) sum += Math.exp(ll[r] - max);
    total += max + Math.log(sum / DRAWS);
    for (let t = 0; t < T; t++) {
      const at = data.diffStart[firstTask + t] - first;
      const rows = data.diffStart[firstTask + t + 1] - first - at;
      hits += scoreTaskHit(rowSum.subarray(at, at + rows), rows, chosenSum[t]);
    }
  }
  const T = data.diffStart.length - 1;
  return { loglik: total, hitRate: T > 0 ? hits / T : NaN };
}

/** Hit rates of each respondent's own coefficients (N × K means, rows in `respondentIds` order). */
export function computeIndividualHitRate(
  data: ChoiceData,
  respondentIds: readonly string[],
  means: Float64Array,
  K: number,
): number {
  const row = new Map(respondentIds.map((id, n) => [id, n]));
  const maxRows = getMaxTaskRows(data);
  const others = new Float64Array(maxRows);
  let hits = 0;
  let tasks = 0;
  data.respondentIds.forEach((id, n) => {
    const m = row.get(id);
    if (m === undefined) return;
    const beta = means.subarray(m * K, (m + 1) * K);
    for (let t = data.taskStart[n]; t < data.taskStart[n + 1]; t++) {
      const rows = data.diffStart[t + 1] - data.diffStart[t];
      const chosen = computeTaskProbabilities(data.diffs, data.diffStart[t], rows, K, beta, others);
      hits += scoreTaskHit(others, rows, chosen);
      tasks++;
    }
  });
  return tasks > 0 ? hits / tasks : NaN;
}
