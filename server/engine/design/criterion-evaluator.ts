/**
 * Task evaluator for the criteria that need the covariance Ω = I⁻¹ (A-error, S-estimate,
 * C-error; design-criteria.ts) in the coordinate exchange. It keeps, per prior draw, the
 * information without the current task (B_r = I_r − I_s,r) and scores a candidate by adding
 * the task's information and inverting directly (K³ per draw). The D-error keeps its own
 * faster evaluator (task-evaluator.ts, Sylvester's identity); this one shares its interface,
 * so the exchange and the swap moves work unchanged. All buffers are allocated here.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { CriterionScorer } from './design-criteria';
import { getRowsPerTask } from './design-grid';
import { addTaskInformation } from './mnl-information';
import type { TaskEvaluator } from './task-evaluator';

/** Creates the direct evaluator over the design matrix `x` (S·Jt × K), shared with the caller. */
export function createCriterionEvaluator(
  plan: CodingPlan,
  S: number,
  x: Float64Array,
  draws: Float64Array,
  R: number,
  scorer: CriterionScorer,
): TaskEvaluator {
  const K = plan.columnCount;
  const Jt = getRowsPerTask(plan);
  const KK = K * K;
  const info = new Float64Array(R * KK);
  const base = new Float64Array(R * KK);
  const trial = new Float64Array(KK);
  const work = new Float64Array(Jt * (K + 1) + K);
  let ridge = 0;

  const scoreTrial = (r: number) => {
    if (ridge > 0) for (let i = 0; i < K; i++) trial[i * K + i] += ridge;
    return scorer.score(trial, 0, draws, r * K);
  };
  const copyLower = (src: Float64Array, offset: number) => {
    for (let i = 0; i < K; i++)
      for (let k = 0; k <= i; k++) trial[i * K + k] = src[offset + i * K + k];
  };
  const applyChange = (s: number, j: number, a: number, from: number, to: number, sign: number) => {
    const attribute = plan.attributes[a];
    const w = attribute.width;
    const row = (s * Jt + j) * K + attribute.offset;
    for (let c = 0; c < w; c++)
      x[row + c] += sign * (attribute.codes[to * w + c] - attribute.codes[from * w + c]);
  };

  return {
    reset(newRidge) {
      ridge = newRidge;
      info.fill(0);
      let sum = 0;
      for (let r = 0; r < R; r++) {
        for (let s = 0; s < S; s++)
          addTaskInformation(K, Jt, x, s * Jt, draws, r * K, info, r * KK, work);
        copyLower(info, r * KK);
        sum += scoreTrial(r);
      }
      return sum / R;
    },

    beginTask(s) {
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        trial.fill(0);
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, trial, 0, work);
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) base[o + i * K + k] = info[o + i * K + k] - trial[i * K + k];
      }
    },

    evaluateChange(s, j, a, from, to, bound) {
      applyChange(s, j, a, from, to, 1);
      const limit = bound * R;
      let sum = 0;
      for (let r = 0; r < R && sum <= limit; r++) {
        copyLower(base, r * KK);
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, trial, 0, work);
        sum += scoreTrial(r);
      }
      applyChange(s, j, a, from, to, -1);
      return sum <= limit ? sum / R : Infinity;
    },

    commitChange(s, j, a, from, to) {
      applyChange(s, j, a, from, to, 1);
    },

    endTask(s) {
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        for (let i = 0; i < K; i++)
          for (let k = 0; k <= i; k++) info[o + i * K + k] = base[o + i * K + k];
        addTaskInformation(K, Jt, x, s * Jt, draws, r * K, info, o, work);
      }
    },
  };
}
