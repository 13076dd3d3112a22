/**
 * Hit rates of a latent class model: population level with P_nj = Σ_c π_nc P_j(β_c) (the prior
 * class probabilities, as for predicting a new respondent) and individual level with the
 * posterior h_nc, which use the respondent's own choices (holdout tasks matched by respondent).
 */
import { getMaxTaskRows, type ChoiceData } from '../estimation/choice-data';
import { computeTaskProbabilities, scoreTaskHit } from '../estimation/score-task-hit';

/**
 * Hit rate on `data` with class weights per respondent: weights(n) returns the C weights of the
 * data's respondent n, or null to skip the respondent.
 */
export function computeClassMixtureHitRate(
  data: ChoiceData,
  betas: Float64Array,
  C: number,
  K: number,
  weights: (n: number) => ArrayLike<number> | null,
): number {
  const maxRows = getMaxTaskRows(data);
  const others = new Float64Array(maxRows);
  const mix = new Float64Array(maxRows);
  let hits = 0;
  let tasks = 0;
  for (let n = 0; n + 1 < data.taskStart.length; n++) {
    const w = weights(n);
    if (!w) continue;
    for (let t = data.taskStart[n]; t < data.taskStart[n + 1]; t++) {
      const rows = data.diffStart[t + 1] - data.diffStart[t];
      mix.fill(0);
      let chosen = 0;
      for (let c = 0; c < C; c++) {
        const p = computeTaskProbabilities(
          data.diffs,
          data.diffStart[t],
          rows,
          K,
          betas.subarray(c * K, (c + 1) * K),
          others,
        );
        chosen += w[c] * p;
        for (let j = 0; j < rows; j++) mix[j] += w[c] * others[j];
      }
      hits += scoreTaskHit(mix, rows, chosen);
      tasks++;
    }
  }
  return tasks > 0 ? hits / tasks : NaN;
}
