/**
 * Incremental (Bayesian) D-error of a design while the cells of one task change — the
 * inner loop of coordinate exchange (Huber & Zwerina 1996; Sándor & Wedel 2001; Kessels et
 * al. 2009). For every prior draw r the information without task s, B_r = I_r − I_s,r, is
 * formed once per task. Changing cells of s then costs, per draw, a Jt × Jt determinant
 * instead of a K × K factorisation, by Sylvester's determinant identity
 *   det(B + X'MX) = det(B) · det(I_Jt + M X B⁻¹ X'),   M = diag(P) − PP',
 * with Y = X B⁻¹ and Z = X B⁻¹ X' kept up to date and a cell change touching only the
 * changed row's entries (cost ∝ Jt·w + w² for an attribute with w coded columns).
 * When some B_r is singular, that task falls back to a direct Cholesky per candidate.
 * The criterion is mean_r det(I_r + ρ·Id)^(−1/K); the ridge ρ > 0 only steers singular
 * starting designs. All buffers are allocated here, none in the loops.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { getSpdLogDet } from '../linalg/cholesky';
import { getDErrorFromLogDet } from './d-error';
import { getSmallLogDet } from './small-log-det';
import { createDrawInformation } from './draw-information';
import { invertSpd } from './spd-inverse';

export interface TaskEvaluator {
  /** Recomputes every draw's information from x; returns the criterion. */
  reset(ridge: number): number;
  /** Prepares task s (its rows in x must be current). */
  beginTask(s: number): void;
  /** Criterion if cell (s, j, a) went from level `from` to `to`; Infinity once above `bound`. */
  evaluateChange(s: number, j: number, a: number, from: number, to: number, bound: number): number;
  /** Applies the change to x and the task's caches. */
  commitChange(s: number, j: number, a: number, from: number, to: number): void;
  /** Folds task s's current rows into the information of every draw. */
  endTask(s: number): void;
}

/** Creates the evaluator over the design matrix `x` (S·Jt × K), shared with the caller. */
export function createTaskEvaluator(
  plan: CodingPlan,
  S: number,
  x: Float64Array,
  draws: Float64Array,
  R: number,
): TaskEvaluator {
  const d = createDrawInformation(plan, x, draws, R);
  const { K, Jt, KK, base, trial } = d;
  const JJ = Jt * Jt;
  const binv = new Float64Array(R * KK);
  const logDetB = new Float64Array(R);
  const Y = new Float64Array(R * Jt * K);
  const Z = new Float64Array(R * JJ);
  const V = new Float64Array(R * Jt);
  const chol = new Float64Array(KK);
  const delta = new Float64Array(K);
  const zc = new Float64Array(JJ);
  const g = new Float64Array(JJ);
  const p = new Float64Array(Jt);
  const q = new Float64Array(Jt);
  let ridge = 0;
  let fast = false;

  const termFromLower = (m: Float64Array) => {
    if (ridge > 0) for (let i = 0; i < K; i++) m[i * K + i] += ridge;
    return getDErrorFromLogDet(K, getSpdLogDet(m, K, chol, 0));
  };
  /** Writes code(to) − code(from) of attribute a into delta[0..w). */
  const fillDelta = (a: number, from: number, to: number) => {
    const attribute = plan.attributes[a];
    const w = attribute.width;
    for (let c = 0; c < w; c++)
      delta[c] = attribute.codes[to * w + c] - attribute.codes[from * w + c];
    return w;
  };
  const applyDelta = (row: number, offset: number, w: number, sign: number) => {
    for (let c = 0; c < w; c++) x[row + offset + c] += sign * delta[c];
  };

  const evaluateDirect = (s: number, bound: number) => {
    const limit = bound * R;
    let sum = 0;
    for (let r = 0; r < R; r++) {
      d.trialWithTask(s, r);
      sum += termFromLower(trial);
      if (!(sum <= limit)) return Infinity;
    }
    return sum / R;
  };

  return {
    reset(newRidge) {
      ridge = newRidge;
      return d.averageOverDraws(S, () => termFromLower(trial));
    },

    beginTask(s) {
      fast = true;
      d.removeTask(s);
      for (let r = 0; r < R && fast; r++) {
        const o = r * KK;
        d.copyToTrial(base, r);
        if (ridge > 0) for (let i = 0; i < K; i++) trial[i * K + i] += ridge;
        logDetB[r] = invertSpd(K, trial, 0, binv, o, chol);
        if (logDetB[r] === -Infinity) fast = false;
      }
      if (!fast) return;
      for (let r = 0; r < R; r++) {
        const o = r * KK;
        for (let j = 0; j < Jt; j++) {
          const row = (s * Jt + j) * K;
          const y = (r * Jt + j) * K;
          let v = 0;
          for (let k = 0; k < K; k++) v += x[row + k] * draws[r * K + k];
          V[r * Jt + j] = v;
          for (let c = 0; c < K; c++) {
            let acc = 0;
            for (let k = 0; k < K; k++) acc += x[row + k] * binv[o + k * K + c];
            Y[y + c] = acc;
          }
        }
        for (let i = 0; i < Jt; i++)
          for (let j = 0; j < Jt; j++) {
            let acc = 0;
            const row = (s * Jt + i) * K;
            const y = (r * Jt + j) * K;
            for (let k = 0; k < K; k++) acc += x[row + k] * Y[y + k];
            Z[r * JJ + i * Jt + j] = acc;
          }
      }
    },

    evaluateChange(s, j, a, from, to, bound) {
      const w = fillDelta(a, from, to);
      const offset = plan.attributes[a].offset;
      const row = (s * Jt + j) * K;
      if (!fast) {
        applyDelta(row, offset, w, 1);
        const value = evaluateDirect(s, bound);
        applyDelta(row, offset, w, -1);
        return value;
      }
      const limit = bound * R;
      let sum = 0;
      for (let r = 0; r < R; r++) {
        const zo = r * JJ;
        for (let t = 0; t < JJ; t++) zc[t] = Z[zo + t];
        // Z'_jk = Z_jk + Δ·Y_k[o..o+w) for k ≠ j; Z'_jj adds 2Δ·Y_j + Δ'B⁻¹Δ.
        let dv = 0;
        for (let k = 0; k < Jt; k++) {
          const y = (r * Jt + k) * K + offset;
          let acc = 0;
          for (let c = 0; c < w; c++) acc += delta[c] * Y[y + c];
          if (k === j) {
            let quad = 0;
            const bo = r * KK + offset * K + offset;
            for (let c = 0; c < w; c++) {
              let t = 0;
              for (let d = 0; d < w; d++) t += binv[bo + c * K + d] * delta[d];
              quad += delta[c] * t;
            }
            zc[j * Jt + j] += 2 * acc + quad;
          } else {
            zc[j * Jt + k] += acc;
            zc[k * Jt + j] += acc;
          }
        }
        for (let c = 0; c < w; c++) dv += delta[c] * draws[r * K + offset + c];
        // Probabilities with the changed utility of row j (max-shifted softmax).
        let max = -Infinity;
        for (let k = 0; k < Jt; k++) {
          const v = V[r * Jt + k] + (k === j ? dv : 0);
          p[k] = v;
          if (v > max) max = v;
        }
        let total = 0;
        for (let k = 0; k < Jt; k++) {
          p[k] = Math.exp(p[k] - max);
          total += p[k];
        }
        for (let k = 0; k < Jt; k++) p[k] /= total;
        // G = I + (diag(P) − PP') Z'.
        for (let k = 0; k < Jt; k++) {
          let acc = 0;
          for (let l = 0; l < Jt; l++) acc += p[l] * zc[l * Jt + k];
          q[k] = acc;
        }
        for (let i = 0; i < Jt; i++)
          for (let k = 0; k < Jt; k++)
            g[i * Jt + k] = (i === k ? 1 : 0) + p[i] * (zc[i * Jt + k] - q[k]);
        const logDetG = getSmallLogDet(Jt, g);
        sum += getDErrorFromLogDet(K, logDetB[r] + logDetG);
        if (!(sum <= limit)) return Infinity;
      }
      return sum / R;
    },

    commitChange(s, j, a, from, to) {
      const w = fillDelta(a, from, to);
      const offset = plan.attributes[a].offset;
      const row = (s * Jt + j) * K;
      applyDelta(row, offset, w, 1);
      if (!fast) return;
      for (let r = 0; r < R; r++) {
        const yj = (r * Jt + j) * K;
        for (let c = 0; c < K; c++) {
          let acc = 0;
          for (let d = 0; d < w; d++) acc += delta[d] * binv[r * KK + (offset + d) * K + c];
          Y[yj + c] += acc;
        }
        let v = 0;
        for (let k = 0; k < K; k++) v += x[row + k] * draws[r * K + k];
        V[r * Jt + j] = v;
        for (let k = 0; k < Jt; k++) {
          const y = (r * Jt + k) * K;
          let acc = 0;
          for (let c = 0; c < K; c++) acc += x[row + c] * Y[y + c];
          Z[r * JJ + j * Jt + k] = acc;
          Z[r * JJ + k * Jt + j] = acc;
        }
      }
    },

    endTask(s) {
      d.restoreTask(s);
    },
  };
}
