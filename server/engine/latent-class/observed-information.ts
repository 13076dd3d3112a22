/**
 * Gradient and Hessian of the observed-data log-likelihood ℓ(θ) = Σ_n ln Σ_c π_nc L_nc of the
 * latent class logit, θ = (β_1, …, β_C, γ), by Louis's identity per respondent (Louis 1982, JRSS B
 * 44:226-233; McLachlan & Krishnan 2008, The EM Algorithm and Extensions, §4.7): with
 * g_nc = π_nc L_nc, s_nc = ∂ ln g_nc/∂θ and posteriors h_nc,
 *   ∂ℓ_n/∂θ = Σ_c h_nc s_nc,
 *   ∂²ℓ_n/∂θ∂θᵀ = Σ_c h_nc (∂² ln g_nc + s_nc s_ncᵀ) − (Σ_c h_nc s_nc)(Σ_c h_nc s_nc)ᵀ.
 * Summed over n the first term is each class's h-weighted MNL Hessian plus the membership MNL's
 * Hessian (it does not depend on c). The negative of this Hessian is the observed information,
 * whose inverse gives the standard errors — not EM's complete-data information, which ignores
 * the uncertainty about class membership and understates them.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { evaluateMnl } from '../estimation/mnl-likelihood';
import type { LatentClassState } from './latent-class-state';
import { getMembershipDerivatives } from './membership-model';

/** Number of parameters of the state's model. */
export function getParameterCount(state: LatentClassState): number {
  return state.C * state.K + (state.C - 1) * state.Mp;
}

/** θ of the state: its betas followed by gamma. */
export function getTheta(state: LatentClassState): Float64Array {
  const theta = new Float64Array(getParameterCount(state));
  theta.set(state.betas);
  theta.set(state.gamma, state.betas.length);
  return theta;
}

/** Puts θ back into the state's betas and gamma. */
export function setTheta(state: LatentClassState, theta: Float64Array): void {
  state.betas.set(theta.subarray(0, state.betas.length));
  state.gamma.set(theta.subarray(state.betas.length));
}

/** ∂ℓ/∂θ and ∂²ℓ/∂θ∂θᵀ at the state, whose posteriors must be current (computePosteriors). */
export function computeObservedDerivatives(
  data: ChoiceData,
  z: Float64Array,
  state: LatentClassState,
): { grad: Float64Array; hess: Float64Array } {
  const { C, K, Mp, h, pi } = state;
  const N = data.taskStart.length - 1;
  const P = getParameterCount(state);
  const G = C * K;
  const Q = (C - 1) * Mp;
  const grad = new Float64Array(P);
  const hess = new Float64Array(P * P);
  const scores = new Float64Array(C * N * K);
  const weights = new Float64Array(N);
  const g = new Float64Array(K);
  const H = new Float64Array(K * K);
  for (let c = 0; c < C; c++) {
    for (let n = 0; n < N; n++) weights[n] = h[n * C + c];
    evaluateMnl(
      data,
      state.betas.subarray(c * K, (c + 1) * K),
      g,
      H,
      scores.subarray(c * N * K, (c + 1) * N * K),
      weights,
    );
    grad.set(g, c * K);
    for (let a = 0; a < K; a++)
      for (let b = 0; b < K; b++) hess[(c * K + a) * P + c * K + b] = H[a * K + b];
  }
  if (Q > 0) {
    const gq = new Float64Array(Q);
    const hq = new Float64Array(Q * Q);
    getMembershipDerivatives(h, pi, z, N, Mp, C, gq, hq);
    grad.set(gq, G);
    for (let a = 0; a < Q; a++)
      for (let b = 0; b < Q; b++) hess[(G + a) * P + G + b] = hq[a * Q + b];
  }
  // Σ_c h s sᵀ − ḡ ḡᵀ per respondent, with s_nc and ḡ_n written out in full.
  const s = new Float64Array(P);
  const mean = new Float64Array(P);
  for (let n = 0; n < N; n++) {
    mean.fill(0);
    for (let c = 0; c < C; c++) {
      const w = h[n * C + c];
      s.fill(0);
      for (let k = 0; k < K; k++) s[c * K + k] = scores[(c * N + n) * K + k];
      for (let d = 1; d < C; d++)
        for (let m = 0; m < Mp; m++)
          s[G + (d - 1) * Mp + m] = ((c === d ? 1 : 0) - pi[n * C + d]) * z[n * Mp + m];
      for (let a = 0; a < P; a++) {
        const wa = w * s[a];
        mean[a] += wa;
        if (wa === 0) continue;
        for (let b = 0; b < P; b++) hess[a * P + b] += wa * s[b];
      }
    }
    for (let a = 0; a < P; a++) {
      if (mean[a] === 0) continue;
      for (let b = 0; b < P; b++) hess[a * P + b] -= mean[a] * mean[b];
    }
  }
  return { grad, hess };
}
