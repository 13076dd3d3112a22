/**
 * The per-draw information bookkeeping both task evaluators of the coordinate exchange share
 * (task-evaluator.ts for the D-error, criterion-evaluator.ts for A, S and C): for every prior
 * draw r the information I_r of the whole design, and while task s changes, the information
 * without it, B_r = I_r − I_s,r. Only lower triangles are kept (row-major, K × K per draw).
 * All buffers are allocated once here; the evaluators read `info`, `base` and `trial`.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { getRowsPerTask } from './design-grid';
import { addTaskInformation } from './mnl-information';

export function createDrawInformation(
  plan: CodingPlan,
  x: Float64Array,
  draws: Float64Array,
  R: number,
) {
  const K = plan.columnCount;
  const Jt = getRowsPerTask(plan);
  const KK = K * K;
  const info = new Float64Array(R * KK);
  const base = new Float64Array(R * KK);
  const trial = new Float64Array(KK);
  const work = new Float64Array(Jt * (K + 1) + K);
  const addTask = (s: number, r: number, out: Float64Array, offset: number) =>
    addTaskInformation(K, Jt, x, s * Jt, draws, r * K, out, offset, work);

  /** Copies draw r's lower triangle of `src` (info or base) into `trial`. */
  const copyToTrial = (src: Float64Array, r: number) => {
    const o = r * KK;
    for (let i = 0; i < K; i++) for (let k = 0; k <= i; k++) trial[i * K + k] = src[o + i * K + k];
  };

  /** I_r of every draw from all S tasks of x. */
  const sumTasks = (S: number) => {
    info.fill(0);
    for (let r = 0; r < R; r++) for (let s = 0; s < S; s++) addTask(s, r, info, r * KK);
  };

  return {
    K,
    Jt,
    KK,
    info,
    base,
    trial,
    sumTasks,
    /** B_r = I_r − I_s,r for every draw (task s's rows in x must be current). */
    removeTask(s: number) {
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        trial.fill(0);
        addTask(s, r, trial, 0);
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) base[o + i * K + k] = info[o + i * K + k] - trial[i * K + k];
      }
    },
    /** I_r = B_r + I_s,r for every draw, with task s's current rows. */
    restoreTask(s: number) {
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) info[o + i * K + k] = base[o + i * K + k];
        addTask(s, r, info, o);
      }
    },
    copyToTrial,
    /**
     * Sums I_r of all S tasks, then averages `score(r)` over the draws, each called with
     * draw r's whole-design information in `trial` (the criterion of the design as it stands).
     */
    averageOverDraws(S: number, score: (r: number) => number) {
      sumTasks(S);
      let sum = 0;
      for (let r = 0; r < R; r++) {
        copyToTrial(info, r);
        sum += score(r);
      }
      return sum / R;
    },
    /** trial = B_r + I_s,r: draw r's information with task s as x has it now. */
    trialWithTask(s: number, r: number) {
      copyToTrial(base, r);
      addTask(s, r, trial, 0);
    },
  };
}
