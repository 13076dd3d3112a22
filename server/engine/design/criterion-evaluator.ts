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
import { createDrawInformation } from './draw-information';
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
  const d = createDrawInformation(plan, x, draws, R);
  const { K, Jt, trial } = d;
  let ridge = 0;

  const scoreTrial = (r: number) => {
    if (ridge > 0) for (let i = 0; i < K; i++) trial[i * K + i] += ridge;
    return scorer.score(trial, 0, draws, r * K);
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
      return d.averageOverDraws(S, scoreTrial);
    },

    beginTask(s) {
      d.removeTask(s);
    },

    evaluateChange(s, j, a, from, to, bound) {
      applyChange(s, j, a, from, to, 1);
      const limit = bound * R;
      let sum = 0;
      for (let r = 0; r < R && sum <= limit; r++) {
        d.trialWithTask(s, r);
        sum += scoreTrial(r);
      }
      applyChange(s, j, a, from, to, -1);
      return sum <= limit ? sum / R : Infinity;
    },

    commitChange(s, j, a, from, to) {
      applyChange(s, j, a, from, to, 1);
    },

    endTask(s) {
      d.restoreTask(s);
    },
  };
}
