/**
 * The per-respondent logit log-likelihood, ln P(y_n | β) = Σ_t −ln(1 + Σ_j e^{β·d_tj}) with
 * d_tj = x_tj − x_t,chosen (Train 2009, eq. 3.6 rearranged; the layout of choice-data.ts). The
 * one kernel the HB sampler calls per proposal, kept small and free of state so a faster
 * implementation (e.g. WebAssembly) can replace it with the same signature. Each utility's
 * exponential (Tang's method, exp-stream.ts, arguments clamped to ±700 so nothing overflows) goes
 * straight into its task's denominator, and the denominators are multiplied and taken to the log
 * scale only when the product grows past 1e250.
 */
import { expTang } from '../linalg/exp-stream';
import type { ChoiceData } from '../estimation/choice-data';

const FLUSH = 1e250;

/**
 * Log-likelihood of respondent n's tasks at β = beta[betaOffset .. betaOffset+K−1], where
 * `diffs` has exactly K columns in coefficient order. `work` needs getMaxRespondentRows(data)
 * entries.
 */
export function computeRespondentLoglik(
  diffs: Float64Array,
  diffStart: Int32Array,
  taskStart: Int32Array,
  n: number,
  K: number,
  beta: Float64Array,
  betaOffset: number,
  work: Float64Array,
): number {
  const firstTask = taskStart[n];
  const lastTask = taskStart[n + 1];
  const first = diffStart[firstTask];
  const rows = diffStart[lastTask] - first;
  for (let i = 0; i < rows; i++) {
    const o = (first + i) * K;
    let v = 0;
    for (let k = 0; k < K; k++) v += beta[betaOffset + k] * diffs[o + k];
    work[i] = v;
  }
  return computeLoglikOfUtilities(work, 0, diffStart, firstTask, lastTask);
}

/**
 * ln P(y | β) of tasks firstTask..lastTask−1 from their utility differences v_i = β·d_i, stored
 * in `v` from `offset` in row order (the rows of task t are diffStart[t]..diffStart[t+1]−1,
 * shifted so that the first task's first row is at `offset`). Reads `v` only.
 */
export function computeLoglikOfUtilities(
  v: Float64Array,
  offset: number,
  diffStart: Int32Array,
  firstTask: number,
  lastTask: number,
): number {
  const first = diffStart[firstTask];
  let ll = 0;
  let product = 1;
  let i = offset;
  for (let t = firstTask; t < lastTask; t++) {
    let denominator = 1;
    for (let end = diffStart[t + 1] - first + offset; i < end; i++) denominator += expTang(v[i]);
    product *= denominator;
    if (product > FLUSH) {
      ll -= Math.log(product);
      product = 1;
    }
  }
  return ll - Math.log(product);
}

/** Largest number of alternative rows (non-chosen alternatives) of one respondent. */
export function getMaxRespondentRows(data: ChoiceData): number {
  let max = 1;
  const { taskStart, diffStart } = data;
  for (let n = 0; n + 1 < taskStart.length; n++)
    max = Math.max(max, diffStart[taskStart[n + 1]] - diffStart[taskStart[n]]);
  return max;
}
