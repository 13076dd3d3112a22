/**
 * The class-membership model of the latent class logit: a multinomial logit over classes,
 * π_nc = exp(z_nᵀγ_c) / Σ_d exp(z_nᵀγ_d), z_n = (1, covariates of n), γ_1 = 0 for identification
 * (Kamakura & Russell 1989, JMR 26:379-390; Greene & Hensher 2003, TR-B 37:681-698). Its M-step
 * maximises Σ_n Σ_c h_nc ln π_nc by Newton-Raphson with step halving (gradient Σ_n (h_nd − π_nd) z_n,
 * Hessian −Σ_n π_nd(δ_de − π_ne) z_n z_nᵀ). γ is stored (C−1) × M' row-major, M' = 1 + covariates.
 */
import { invertMatrix } from '../linalg/invert-matrix';
import type { MembershipCovariates } from './check-latent-class-options';

const MAX_NEWTON = 50;

/** z_n = (1, covariates): N × (1 + M). */
export function createMembershipDesign(N: number, covariates: MembershipCovariates): Float64Array {
  const M = covariates.names.length;
  const z = new Float64Array(N * (M + 1));
  for (let n = 0; n < N; n++) {
    z[n * (M + 1)] = 1;
    for (let m = 0; m < M; m++) z[n * (M + 1) + 1 + m] = covariates.values[n * M + m];
  }
  return z;
}

/** Writes π (N × C) at γ. */
export function computeMembership(
  gamma: Float64Array,
  z: Float64Array,
  N: number,
  Mp: number,
  C: number,
  pi: Float64Array,
): void {
  for (let n = 0; n < N; n++) {
    let max = 0;
    pi[n * C] = 0;
    for (let c = 1; c < C; c++) {
      let v = 0;
      for (let m = 0; m < Mp; m++) v += gamma[(c - 1) * Mp + m] * z[n * Mp + m];
      pi[n * C + c] = v;
      if (v > max) max = v;
    }
    let sum = 0;
    for (let c = 0; c < C; c++) sum += pi[n * C + c] = Math.exp(pi[n * C + c] - max);
    for (let c = 0; c < C; c++) pi[n * C + c] /= sum;
  }
}

function objective(h: Float64Array, pi: Float64Array, N: number, C: number): number {
  let f = 0;
  for (let i = 0; i < N * C; i++) if (h[i] > 0) f += h[i] * Math.log(pi[i]);
  return f;
}

/**
 * Gradient (Q = (C−1)·Mp) and Hessian (Q × Q) of Σ_n Σ_c w_nc ln π_nc at π; used by the M-step
 * (w = h) and by the observed information (w = h, whose Σ_c w_nc = 1).
 */
export function getMembershipDerivatives(
  w: Float64Array,
  pi: Float64Array,
  z: Float64Array,
  N: number,
  Mp: number,
  C: number,
  grad: Float64Array,
  hess: Float64Array,
): void {
  const Q = (C - 1) * Mp;
  grad.fill(0);
  hess.fill(0);
  for (let n = 0; n < N; n++) {
    for (let d = 1; d < C; d++) {
      const r = w[n * C + d] - pi[n * C + d];
      for (let m = 0; m < Mp; m++) grad[(d - 1) * Mp + m] += r * z[n * Mp + m];
      for (let e = 1; e < C; e++) {
        const c = pi[n * C + d] * ((d === e ? 1 : 0) - pi[n * C + e]);
        for (let m = 0; m < Mp; m++)
          for (let l = 0; l < Mp; l++)
            hess[((d - 1) * Mp + m) * Q + (e - 1) * Mp + l] -= c * z[n * Mp + m] * z[n * Mp + l];
      }
    }
  }
}

/** M-step for γ given posteriors h (N × C); updates gamma and pi in place. Never lowers the objective. */
export function maximizeMembership(
  h: Float64Array,
  z: Float64Array,
  N: number,
  Mp: number,
  C: number,
  gamma: Float64Array,
  pi: Float64Array,
): void {
  const Q = (C - 1) * Mp;
  if (Q === 0) return;
  const grad = new Float64Array(Q);
  const hess = new Float64Array(Q * Q);
  const trial = new Float64Array(Q);
  const trialPi = new Float64Array(N * C);
  computeMembership(gamma, z, N, Mp, C, pi);
  let f = objective(h, pi, N, C);
  for (let it = 0; it < MAX_NEWTON; it++) {
    getMembershipDerivatives(h, pi, z, N, Mp, C, grad, hess);
    const inv = invertMatrix(
      hess.map((x) => -x),
      Q,
    );
    if (!inv) return;
    let decrement = 0;
    const step = new Float64Array(Q);
    for (let a = 0; a < Q; a++) {
      for (let b = 0; b < Q; b++) step[a] += inv[a * Q + b] * grad[b];
      decrement += step[a] * grad[a];
    }
    if (!(decrement > 1e-14)) return;
    let lambda = 1;
    for (let halvings = 0; halvings < 30; halvings++, lambda /= 2) {
      for (let q = 0; q < Q; q++) trial[q] = gamma[q] + lambda * step[q];
      computeMembership(trial, z, N, Mp, C, trialPi);
      const next = objective(h, trialPi, N, C);
      if (next >= f) {
        gamma.set(trial);
        pi.set(trialPi);
        f = next;
        break;
      }
    }
    if (lambda < 1e-8) return;
  }
}
