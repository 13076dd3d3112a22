/**
 * The conjugate layers of the HB sampler against their closed forms, by the moments of many
 * seeded draws. Each tolerance is 4 Monte Carlo standard errors, estimated from the draws
 * themselves (SE of a mean: s/√M; of a variance: √((m₄ − s⁴)/M)), so a correct sampler fails
 * with probability about 6e-5 per check.
 */
import { describe, expect, it } from 'vitest';
import { drawChiSquare, drawGamma } from '../../../server/engine/draws/gamma-variate';
import { createPrng } from '../../../server/engine/draws/prng';
import {
  createWishartWorkspace,
  drawInverseWishart,
} from '../../../server/engine/hb/inverse-wishart';
import {
  createGibbsWorkspace,
  drawPopulationCovariance,
  drawPopulationMean,
} from '../../../server/engine/hb/gibbs-conditionals';
import { invertMatrix } from '../../../server/engine/linalg/invert-matrix';

const M = 20_000;

/** Checks that draws (M × P) have mean `mean` and, where given, variance `variance` per column. */
function expectMoments(draws: Float64Array, P: number, mean: number[], variance?: number[]) {
  for (let p = 0; p < P; p++) {
    let m = 0;
    for (let i = 0; i < M; i++) m += draws[i * P + p];
    m /= M;
    let s2 = 0;
    let m4 = 0;
    for (let i = 0; i < M; i++) {
      const d = draws[i * P + p] - m;
      s2 += d * d;
      m4 += d ** 4;
    }
    s2 /= M - 1;
    m4 /= M;
    expect(Math.abs(m - mean[p])).toBeLessThan(4 * Math.sqrt(s2 / M));
    if (variance)
      expect(Math.abs(s2 - variance[p])).toBeLessThan(4 * Math.sqrt((m4 - s2 * s2) / M));
  }
}

describe('gamma and chi-square variates (Marsaglia & Tsang 2000)', () => {
  it('Gamma(a, 1) has mean a and variance a, for a below and above 1', () => {
    for (const a of [0.4, 3.7]) {
      const prng = createPrng(11, 1);
      const draws = Float64Array.from({ length: M }, () => drawGamma(a, prng));
      expectMoments(draws, 1, [a], [a]);
    }
  });
  it('χ²(ν) has mean ν and variance 2ν', () => {
    const prng = createPrng(12, 1);
    const draws = Float64Array.from({ length: M }, () => drawChiSquare(7.5, prng));
    expectMoments(draws, 1, [7.5], [15]);
  });
});

describe('inverse-Wishart draws (Bartlett decomposition)', () => {
  it('IW(ν, Ψ) has mean Ψ/(ν−K−1) and the closed-form element variances', () => {
    // Var(Σ_ij) = [(ν−K+1)ψ_ij² + (ν−K−1)ψ_ii ψ_jj] / [(ν−K)(ν−K−1)²(ν−K−3)] (Press 1982,
    // Applied Multivariate Analysis, §5.2; the same values as scipy.stats.invwishart.var).
    const K = 3;
    const nu = 20;
    const psi = Float64Array.from([2, 0.6, -0.3, 0.6, 1.5, 0.2, -0.3, 0.2, 1]);
    const prng = createPrng(13, 1);
    const ws = createWishartWorkspace(K);
    const sigma = new Float64Array(K * K);
    const sigmaInv = new Float64Array(K * K);
    const draws = new Float64Array(M * K * K);
    for (let i = 0; i < M; i++) {
      if (!drawInverseWishart(nu, psi, prng, sigma, sigmaInv, ws)) throw new Error('draw failed');
      draws.set(sigma, i * K * K);
    }
    const mean = [...psi].map((x) => x / (nu - K - 1));
    const variance = [...psi].map((x, e) => {
      const i = Math.floor(e / K);
      const j = e % K;
      return (
        ((nu - K + 1) * x * x + (nu - K - 1) * psi[i * K + i] * psi[j * K + j]) /
        ((nu - K) * (nu - K - 1) ** 2 * (nu - K - 3))
      );
    });
    // scipy.stats.invwishart(20, Ψ).mean()[0,0] = 0.125 and .var()[0,0] = 0.00223214 (printed once).
    expect(mean[0]).toBeCloseTo(0.125, 12);
    expect(variance[0]).toBeCloseTo(0.00223214, 8);
    expectMoments(draws, K * K, mean, variance);
    // The inverse comes with the draw.
    const product = new Float64Array(K * K);
    for (let i = 0; i < K; i++)
      for (let j = 0; j < K; j++)
        for (let k = 0; k < K; k++) product[i * K + j] += sigma[i * K + k] * sigmaInv[k * K + j];
    product.forEach((x, e) => expect(x).toBeCloseTo(e % (K + 1) === 0 ? 1 : 0, 10));
  });
});

/** A fixed set of individual vectors α_n (N × K) for the conditional checks. */
function makeAlpha(N: number, K: number): Float64Array {
  const prng = createPrng(5, 9);
  return Float64Array.from({ length: N * K }, (_, e) => (e % K) - 0.5 + prng.nextDouble());
}

describe('μ | α, Σ (normal conditional)', () => {
  it('has mean V(m₀/v₀·1 + Σ⁻¹Σα_n) and covariance V = (I/v₀ + NΣ⁻¹)⁻¹', () => {
    const K = 2;
    const N = 15;
    const alpha = makeAlpha(N, K);
    const sigma = Float64Array.from([0.8, 0.3, 0.3, 0.5]);
    const sigmaInv = invertMatrix(sigma, K)!;
    const prior = { muMean: 0.5, muVariance: 2 };
    const precision = [0, 1, 2, 3].map(
      (e) => N * sigmaInv[e] + (e === 0 || e === 3 ? 1 / prior.muVariance : 0),
    );
    const V = invertMatrix(Float64Array.from(precision), K)!;
    const sum = [0, 1].map((k) =>
      Array.from({ length: N }, (_, n) => alpha[n * K + k]).reduce((a, b) => a + b),
    );
    const rhs = [0, 1].map(
      (i) =>
        prior.muMean / prior.muVariance + sigmaInv[i * K] * sum[0] + sigmaInv[i * K + 1] * sum[1],
    );
    const m = [0, 1].map((i) => V[i * K] * rhs[0] + V[i * K + 1] * rhs[1]);
    const prng = createPrng(14, 1);
    const ws = createGibbsWorkspace(K);
    const mu = new Float64Array(K);
    const draws = new Float64Array(M * 3);
    for (let i = 0; i < M; i++) {
      if (!drawPopulationMean(alpha, N, sigmaInv, prior, prng, mu, ws))
        throw new Error('draw failed');
      draws[i * 3] = mu[0];
      draws[i * 3 + 1] = mu[1];
      // Product of the centred components: its mean is the covariance V₀₁.
      draws[i * 3 + 2] = (mu[0] - m[0]) * (mu[1] - m[1]);
    }
    expectMoments(draws, 3, [m[0], m[1], V[1]], [V[0], V[3], V[0] * V[3] + V[1] * V[1]]);
  });
});

describe('Σ | α, μ (inverse-Wishart conditional)', () => {
  const K = 3;
  const N = 25;
  const alpha = makeAlpha(N, K);
  const mu = Float64Array.from([-0.2, 0.6, 1.4]);
  const prior = { nu: K + 3, scale: K + 3 };
  const S = new Float64Array(K * K);
  for (let n = 0; n < N; n++)
    for (let i = 0; i < K; i++)
      for (let j = 0; j < K; j++)
        S[i * K + j] += (alpha[n * K + i] - mu[i]) * (alpha[n * K + j] - mu[j]);

  it('full covariance: IW(ν + N, s·I + S) with mean (s·I + S)/(ν + N − K − 1)', () => {
    const prng = createPrng(15, 1);
    const ws = createGibbsWorkspace(K);
    const sigma = new Float64Array(K * K);
    const sigmaInv = new Float64Array(K * K);
    const draws = new Float64Array(M * K * K);
    for (let i = 0; i < M; i++) {
      if (!drawPopulationCovariance(alpha, N, mu, prior, true, prng, sigma, sigmaInv, ws))
        throw new Error('draw failed');
      draws.set(sigma, i * K * K);
    }
    const nu = prior.nu + N;
    const mean = [...S].map((x, e) => (x + (e % (K + 1) === 0 ? prior.scale : 0)) / (nu - K - 1));
    expectMoments(draws, K * K, mean);
  });

  it('diagonal covariance: σ²_k = (s + S_kk)/χ²(ν − K + 1 + N), mean (s + S_kk)/(ν − K − 1 + N)', () => {
    const prng = createPrng(16, 1);
    const ws = createGibbsWorkspace(K);
    const sigma = new Float64Array(K * K);
    const sigmaInv = new Float64Array(K * K);
    const draws = new Float64Array(M * K);
    for (let i = 0; i < M; i++) {
      if (!drawPopulationCovariance(alpha, N, mu, prior, false, prng, sigma, sigmaInv, ws))
        throw new Error('draw failed');
      for (let k = 0; k < K; k++) draws[i * K + k] = sigma[k * K + k];
    }
    expect(sigma[1]).toBe(0);
    // Scaled inverse-χ² with d = ν − K + 1 + N degrees of freedom (BDA3 §3.3 / Appendix A):
    // mean (s + S_kk)/(d − 2), variance 2(s + S_kk)²/((d − 2)²(d − 4)).
    const d = prior.nu - K + 1 + N;
    const scale = [0, 1, 2].map((k) => prior.scale + S[k * K + k]);
    expectMoments(
      draws,
      K,
      scale.map((b) => b / (d - 2)),
      scale.map((b) => (2 * b * b) / ((d - 2) ** 2 * (d - 4))),
    );
  });
});
