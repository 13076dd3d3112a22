/**
 * The two conjugate layers of the HB logit's Gibbs sampler (Allenby & Rossi 1999, Journal of
 * Econometrics 89:57-78; Train 2009, Discrete Choice Methods with Simulation, §12.6; Rossi,
 * Allenby & McCulloch 2005, §2.8 and §5.5), for N individual vectors α_n ∈ ℝᴷ ~ N(μ, Σ):
 *   μ | α, Σ ~ N(m, V),  V = (I/v₀ + N Σ⁻¹)⁻¹,  m = V (m₀/v₀ · 1 + Σ⁻¹ Σ_n α_n)   [prior μ ~ N(m₀1, v₀I)]
 *   Σ | α, μ ~ IW(ν + N, s·I + S),  S = Σ_n (α_n − μ)(α_n − μ)ᵀ               [prior Σ ~ IW(ν, s·I)]
 * With a diagonal Σ each variance has the marginal of that prior, IW₁(ν − K + 1, s), so
 * σ²_k | α, μ = (s + S_kk) / χ²(ν − K + 1 + N) (Gelman et al. 2013, BDA3, §3.3 for the
 * scaled inverse chi-square form).
 */
import { drawChiSquare, drawStandardNormal } from '../draws/gamma-variate';
import type { Prng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import { invertSpd } from '../design/spd-inverse';
import {
  createWishartWorkspace,
  drawInverseWishart,
  type WishartWorkspace,
} from './inverse-wishart';

export interface GibbsWorkspace {
  K: number;
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
  v: Float64Array;
  /** N × K deviations α_n − μ, sized on first use. */
  deviations: Float64Array;
  wishart: WishartWorkspace;
}

export function createGibbsWorkspace(K: number): GibbsWorkspace {
  return {
    K,
    a: new Float64Array(K * K),
    b: new Float64Array(K * K),
    c: new Float64Array(K * K),
    v: new Float64Array(K),
    deviations: new Float64Array(0),
    wishart: createWishartWorkspace(K),
  };
}

/**
 * Draws μ | α, Σ into `mu`. `alpha` holds N rows of K (row-major); `sigmaInv` is Σ⁻¹.
 * Returns false when the posterior covariance is not positive definite.
 */
export function drawPopulationMean(
  alpha: Float64Array,
  N: number,
  sigmaInv: Float64Array,
  prior: { muMean: number; muVariance: number },
  prng: Prng,
  mu: Float64Array,
  ws: GibbsWorkspace,
): boolean {
  const { K, a: precision, b: covariance, c: chol, v: rhs } = ws;
  mu.fill(0, 0, K);
  for (let n = 0; n < N; n++) for (let k = 0; k < K; k++) mu[k] += alpha[n * K + k];
  for (let i = 0; i < K; i++) {
    let s = prior.muMean / prior.muVariance;
    for (let j = 0; j < K; j++) {
      precision[i * K + j] = N * sigmaInv[i * K + j] + (i === j ? 1 / prior.muVariance : 0);
      s += sigmaInv[i * K + j] * mu[j];
    }
    rhs[i] = s;
  }
  if (invertSpd(K, precision, 0, covariance, 0, chol) === -Infinity) return false;
  if (!choleskyDecompose(covariance, K, chol)) return false;
  for (let i = 0; i < K; i++) {
    let m = 0;
    for (let j = 0; j < K; j++) m += covariance[i * K + j] * rhs[j];
    mu[i] = m;
  }
  // Reuse rhs for the standard normals: μ = m + chol(V)·z.
  for (let k = 0; k < K; k++) rhs[k] = drawStandardNormal(prng);
  for (let i = K - 1; i >= 0; i--) {
    let s = 0;
    for (let j = 0; j <= i; j++) s += chol[i * K + j] * rhs[j];
    mu[i] += s;
  }
  return true;
}

/**
 * Draws Σ | α, μ into `sigma` with its inverse in `sigmaInv` (diagonal when !correlated).
 * Returns false when the draw is not positive definite.
 */
export function drawPopulationCovariance(
  alpha: Float64Array,
  N: number,
  mu: Float64Array,
  prior: { nu: number; scale: number },
  correlated: boolean,
  prng: Prng,
  sigma: Float64Array,
  sigmaInv: Float64Array,
  ws: GibbsWorkspace,
): boolean {
  const { K, a: psi } = ws;
  if (ws.deviations.length < N * K) ws.deviations = new Float64Array(N * K);
  const dev = ws.deviations;
  for (let n = 0; n < N; n++) for (let k = 0; k < K; k++) dev[n * K + k] = alpha[n * K + k] - mu[k];
  psi.fill(0);
  // Each entry of S sums its N products in respondent order (as a running sum over respondents
  // would), but in a register: two entries per pass over the deviations.
  for (let i = 0; i < K; i++) {
    let j = correlated ? 0 : i;
    for (; j + 1 <= i; j += 2) {
      let s0 = 0;
      let s1 = 0;
      for (let o = 0; o < N * K; o += K) {
        const d = dev[o + i];
        s0 += d * dev[o + j];
        s1 += d * dev[o + j + 1];
      }
      psi[i * K + j] = s0;
      psi[i * K + j + 1] = s1;
    }
    if (j === i) {
      let s = 0;
      for (let o = 0; o < N * K; o += K) s += dev[o + i] * dev[o + i];
      psi[i * K + i] = s;
    }
  }
  if (!correlated) {
    sigma.fill(0);
    sigmaInv.fill(0);
    for (let k = 0; k < K; k++) {
      const variance = (prior.scale + psi[k * K + k]) / drawChiSquare(prior.nu - K + 1 + N, prng);
      if (!(variance > 0) || !Number.isFinite(variance)) return false;
      sigma[k * K + k] = variance;
      sigmaInv[k * K + k] = 1 / variance;
    }
    return true;
  }
  for (let i = 0; i < K; i++) {
    psi[i * K + i] += prior.scale;
    for (let j = 0; j < i; j++) psi[j * K + i] = psi[i * K + j];
  }
  return drawInverseWishart(prior.nu + N, psi, prng, sigma, sigmaInv, ws.wishart);
}
