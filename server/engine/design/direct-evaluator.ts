/**
 * Incremental (Bayesian) D-error of a design under change of one task, by direct
 * refactorisation: for each prior draw r the information matrix without task s,
 * B_r = I_r − I_s,r, is kept while the cells of task s are explored; a candidate costs
 * I_s,r(candidate) plus one Cholesky log-determinant per draw (Huber & Zwerina 1996;
 * Sándor & Wedel 2001). Used when B_r is singular; see low-rank-evaluator.ts for the fast path.
 *
 * The criterion is mean_r det(I_r + ρ·Id)^(−1/K); the ridge ρ > 0 is only used to steer a
 * singular starting design toward identifiability and is 0 otherwise.
 */
import { getCholeskyLogDet } from './cholesky-log-det';
import { getDErrorFromLogDet } from './d-error';
import { addTaskInformation } from './mnl-information';

export interface DesignBuffers {
  K: number;
  S: number;
  /** Rows per task (designed + fixed). */
  Jt: number;
  /** S·Jt × K design matrix, kept in sync with the grid by the caller. */
  x: Float64Array;
  /** R × K draws. */
  draws: Float64Array;
  R: number;
}

export interface DirectEvaluator {
  /** Recomputes every draw's information matrix from x and returns the criterion. */
  reset(ridge: number): number;
  /** Prepares B_r = I_r − I_s,r for task s (x rows of s must be current). */
  beginTask(s: number): void;
  /** Criterion with task s as currently in x; stops early (returns Infinity) above `bound`. */
  evaluateTask(s: number, bound: number): number;
  /** Makes task s's current rows part of I_r. */
  commitTask(s: number): void;
}

/** Creates the direct evaluator; all buffers are allocated once here. */
export function createDirectEvaluator(buf: DesignBuffers): DirectEvaluator {
  const { K, S, Jt, x, draws, R } = buf;
  const KK = K * K;
  const info = new Float64Array(R * KK);
  const base = new Float64Array(R * KK);
  const trial = new Float64Array(KK);
  const chol = new Float64Array(KK);
  const work = new Float64Array(Jt * (K + 1) + K);
  let ridge = 0;

  const criterionTerm = (m: Float64Array, offset: number) => {
    if (ridge > 0) for (let i = 0; i < K; i++) m[offset + i * K + i] += ridge;
    return getDErrorFromLogDet(K, getCholeskyLogDet(K, m, offset, chol));
  };

  return {
    reset(newRidge) {
      ridge = newRidge;
      info.fill(0);
      let sum = 0;
      for (let r = 0; r < R; r++) {
        for (let s = 0; s < S; s++)
          addTaskInformation(K, Jt, x, s * Jt, draws, r * K, info, r * KK, work);
        trial.set(info.subarray(r * KK, (r + 1) * KK));
        sum += criterionTerm(trial, 0);
      }
      return sum / R;
    },
    beginTask(s) {
      base.set(info);
      for (let r = 0; r < R; r++) {
        trial.fill(0);
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, trial, 0, work);
        const o = r * KK;
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) base[o + i * K + k] -= trial[i * K + k];
      }
    },
    evaluateTask(s, bound) {
      const limit = bound * R;
      let sum = 0;
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) trial[i * K + k] = base[o + i * K + k];
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, trial, 0, work);
        sum += criterionTerm(trial, 0);
        if (!(sum <= limit)) return Infinity;
      }
      return sum / R;
    },
    commitTask(s) {
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) info[o + i * K + k] = base[o + i * K + k];
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, info, o, work);
      }
    },
  };
}
