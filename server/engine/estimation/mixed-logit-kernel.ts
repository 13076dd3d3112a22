/**
 * Simulated panel log-likelihood and its analytic gradient for the mixed logit (Train 2009,
 * eq. 6.2 and §10.2): ln L_n = ln (1/R) Σ_r Π_t P_nt(β_r), with P_nt = 1/(1 + Σ_j e^{β_r·d_j})
 * (d_j = x_j − x_chosen) and ∂ln L_n/∂θ = Σ_r w_r Σ_t (−Σ_j P_ntj d_j)·∂β_r/∂θ,
 * w_r = Π_t P_nt(β_r) / Σ_r' Π_t P_nt(β_r'). Loops run over draws innermost on Float64Array
 * workspaces allocated once per kernel, utilities and gradients use fused multi-stream axpy,
 * exponentials are taken as one stream per alternative (Tang's table method, exp-stream.ts),
 * and products over tasks are moved to the log scale every 8 tasks so long panels cannot
 * underflow. One kernel covers a contiguous slice of respondents (one worker thread's share).
 *
 * WTP space (layout.wtpCost ≥ 0; Train & Weeks 2005): the draws of the model's own coefficients
 * ("raw": the cost and the WTPs w_k) are kept apart from the utility coefficients
 * β_k = −β_cost·w_k, and the gradient with respect to β is mapped back to the raw draws
 * (∂/∂w_k = −β_cost·∂/∂β_k, ∂/∂β_cost gains −Σ_k w_k·∂/∂β_k) before the chain rule through
 * each distribution.
 */
import { expStreamAccumulate } from '../linalg/exp-stream';
import { fusedAxpy } from '../linalg/fused-axpy';
import { getMaxRespondentRows, type ChoiceData } from './choice-data';
import { getDrawStride } from './standard-variates';
import { fillCoefficientDraws } from './coefficient-draws';
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  type MixedLogitLayout,
} from './mixed-logit-layout';

/** A log-likelihood + gradient evaluator over a fixed slice of respondents. */
export interface LoglikKernel {
  readonly parameterCount: number;
  readonly respondentCount: number;
  /**
   * Returns Σ_n ln L_n over the slice at θ and writes its gradient into `grad` (length P).
   * With `scores` (respondentCount × P) also writes each respondent's gradient.
   */
  evaluate(theta: Float64Array, grad: Float64Array, scores?: Float64Array | null): number;
}

export interface MixedLogitKernel extends LoglikKernel {
  /**
   * For local respondent n: fills `betas` (K × R, coefficient-major) with the utility
   * coefficients β_r (in WTP space β_k = −β_cost·w_k) and `weights` (R) with the normalised
   * w_r; returns ln L_n.
   */
  simulateRespondent(
    n: number,
    theta: Float64Array,
    betas: Float64Array,
    weights: Float64Array,
  ): number;
}

const LOG_CHUNK = 8;

/**
 * Creates the kernel for respondents first..first+count−1 of `data`, with standard variates
 * `variates` laid out [local respondent][dimension][getDrawStride(R)] (see
 * createStandardVariates).
 */
export function createMixedLogitKernel(
  data: ChoiceData,
  layout: MixedLogitLayout,
  variates: Float32Array,
  R: number,
  first: number,
  count: number,
): MixedLogitKernel {
  const { K, D, P, dist, column, dimension, meanIndex, spreadIndex, block, cholIndex } = layout;
  const Kd = data.columns.length;
  const stride = getDrawStride(R);
  const { diffs, diffStart, taskStart } = data;
  // Largest number of alternative rows of one respondent: V keeps all of them so the
  // gradient can be accumulated in one fused pass per coefficient after the last task.
  const maxRows = getMaxRespondentRows(data, first, count);
  const B = new Float64Array(K * R);
  const wtpCost = layout.wtpCost;
  // Raw draws of the model's coefficients; the same array as B in preference space.
  const raw = wtpCost >= 0 ? new Float64Array(K * R) : B;
  const G = new Float64Array(K * R);
  const V = new Float64Array(maxRows * R);
  const den = new Float64Array(R);
  const prod = new Float64Array(R);
  const lp = new Float64Array(R);
  const w = new Float64Array(R);
  const gn = new Float64Array(P);
  const coef = new Float64Array(Math.max(K, maxRows));
  const offs = new Int32Array(Math.max(K, maxRows));
  const blockSize = block.length;
  const blockDims = Int32Array.from(block, (k) => dimension[k]);

  /** Utility coefficients of local respondent n into B (raw draws into `raw` first). */
  function fillBetas(n: number, theta: Float64Array): void {
    fillRawDraws(n, theta, raw);
    if (wtpCost < 0) return;
    const cb = wtpCost * R;
    for (let k = 0; k < K; k++) {
      const base = k * R;
      if (k === wtpCost) for (let r = 0; r < R; r++) B[base + r] = raw[base + r];
      else for (let r = 0; r < R; r++) B[base + r] = -raw[cb + r] * raw[base + r];
    }
  }

  /** WTP space: turns G = ∂ln L/∂β (per draw) into the gradient with respect to the raw draws. */
  function mapGradientToRaw(): void {
    const cb = wtpCost * R;
    for (let r = 0; r < R; r++) {
      let gc = G[cb + r];
      const cost = raw[cb + r];
      for (let k = 0; k < K; k++) {
        if (k === wtpCost) continue;
        gc -= G[k * R + r] * raw[k * R + r];
        G[k * R + r] *= -cost;
      }
      G[cb + r] = gc;
    }
  }

  function fillRawDraws(n: number, theta: Float64Array, out: Float64Array): void {
    fillCoefficientDraws(layout, theta, variates, n * D * stride, stride, R, out);
  }

  /** Fills lp (log Π_t P_nt per draw) and G (Σ_t ∂ln P_nt/∂β per draw) for local respondent n. */
  function simulateTasks(n: number, withGradient: boolean): void {
    lp.fill(0);
    prod.fill(1);
    const gFirst = first + n;
    const rowBase = diffStart[taskStart[gFirst]];
    let sinceLog = 0;
    for (let t = taskStart[gFirst]; t < taskStart[gFirst + 1]; t++) {
      const row0 = diffStart[t];
      const rows = diffStart[t + 1] - row0;
      den.fill(1);
      for (let j = 0; j < rows; j++) {
        const vb = (row0 - rowBase + j) * R;
        const dRow = (row0 + j) * Kd;
        let m = 0;
        for (let k = 0; k < K; k++) {
          const d = diffs[dRow + column[k]];
          if (d === 0) continue;
          coef[m] = d;
          offs[m++] = k * R;
        }
        fusedAxpy(V, vb, B, coef, offs, m, R, true);
        expStreamAccumulate(V, vb, R, den, 0);
      }
      // P_chosen = 1/den; with the gradient, the rows' e^v become P_j = e^v/den in the same pass.
      const taskBase = (row0 - rowBase) * R;
      for (let r = 0; r < R; r++) {
        const p = 1 / den[r];
        prod[r] *= p;
        if (withGradient) for (let j = 0; j < rows; j++) V[taskBase + j * R + r] *= p;
      }
      if (++sinceLog === LOG_CHUNK) {
        for (let r = 0; r < R; r++) {
          lp[r] += Math.log(prod[r]);
          prod[r] = 1;
        }
        sinceLog = 0;
      }
    }
    if (withGradient) {
      // G_k = −Σ_t Σ_j d_tjk · P_tj over all the respondent's rows, fused per coefficient.
      const rowEnd = diffStart[taskStart[gFirst + 1]];
      for (let k = 0; k < K; k++) {
        let m = 0;
        for (let row = rowBase; row < rowEnd; row++) {
          const d = diffs[row * Kd + column[k]];
          if (d === 0) continue;
          coef[m] = -d;
          offs[m++] = (row - rowBase) * R;
        }
        fusedAxpy(G, k * R, V, coef, offs, m, R, true);
      }
    }
    if (sinceLog > 0) for (let r = 0; r < R; r++) lp[r] += Math.log(prod[r]);
  }

  /** Normalised weights into `weights`; returns ln L_n (−Infinity if every draw underflows). */
  function normaliseWeights(weights: Float64Array): number {
    let max = -Infinity;
    for (let r = 0; r < R; r++) if (lp[r] > max) max = lp[r];
    if (max === -Infinity) return -Infinity;
    let sum = 0;
    for (let r = 0; r < R; r++) sum += weights[r] = Math.exp(lp[r] - max);
    const inv = 1 / sum;
    for (let r = 0; r < R; r++) weights[r] *= inv;
    return max + Math.log(sum / R);
  }

  function accumulateGradient(n: number): void {
    gn.fill(0);
    const drawBase = n * D * stride;
    for (let k = 0; k < K; k++) {
      const gb = k * R;
      const code = dist[k];
      let gm = 0;
      let gs = 0;
      if (code === DIST_FIXED) {
        for (let r = 0; r < R; r++) gm += w[r] * G[gb + r];
      } else if (code === DIST_LOGNORMAL || code === DIST_NEG_LOGNORMAL) {
        const eta = drawBase + dimension[k] * stride;
        for (let r = 0; r < R; r++) {
          const x = w[r] * G[gb + r] * raw[gb + r];
          gm += x;
          gs += x * variates[eta + r];
        }
      } else {
        const eta = drawBase + dimension[k] * stride;
        for (let r = 0; r < R; r++) {
          const x = w[r] * G[gb + r];
          gm += x;
          gs += x * variates[eta + r];
        }
      }
      gn[meanIndex[k]] += gm;
      if (spreadIndex[k] >= 0) gn[spreadIndex[k]] += gs;
    }
    for (let i = 0; i < blockSize; i++) {
      const gb = block[i] * R;
      for (let l = 0; l <= i; l++) {
        const eta = drawBase + blockDims[l] * stride;
        let s = 0;
        for (let r = 0; r < R; r++) s += w[r] * G[gb + r] * variates[eta + r];
        gn[cholIndex[i * blockSize + l]] += s;
      }
    }
  }

  return {
    parameterCount: P,
    respondentCount: count,
    evaluate(theta, grad, scores = null) {
      grad.fill(0, 0, P);
      let ll = 0;
      for (let n = 0; n < count; n++) {
        fillBetas(n, theta);
        simulateTasks(n, true);
        const lnL = normaliseWeights(w);
        ll += lnL;
        if (lnL === -Infinity) continue;
        if (wtpCost >= 0) mapGradientToRaw();
        accumulateGradient(n);
        for (let p = 0; p < P; p++) grad[p] += gn[p];
        if (scores) scores.set(gn, n * P);
      }
      return ll;
    },
    simulateRespondent(n, theta, betas, weights) {
      fillBetas(n, theta);
      simulateTasks(n, false);
      betas.set(B);
      return normaliseWeights(weights);
    },
  };
}
