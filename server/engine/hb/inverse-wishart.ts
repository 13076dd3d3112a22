/**
 * Inverse-Wishart draws Σ ~ IW(ν, Ψ) (density ∝ |Σ|^{−(ν+K+1)/2} exp(−½ tr ΨΣ⁻¹), E[Σ] = Ψ/(ν−K−1))
 * through the Bartlett decomposition of W = Σ⁻¹ ~ Wishart(ν, Ψ⁻¹): with Ψ⁻¹ = CCᵀ and A lower
 * triangular, A_ii² ~ χ²(ν − i) (i = 0..K−1), A_ij ~ N(0, 1) below the diagonal, W = (CA)(CA)ᵀ
 * (Bartlett 1933; Anderson 2003, An Introduction to Multivariate Statistical Analysis, 3rd ed.,
 * §7.2). Real ν > K − 1 is allowed (chi-square by the gamma sampler).
 */
import { drawChiSquare, drawStandardNormal } from '../draws/gamma-variate';
import type { Prng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import {
  invertLower,
  multiplyLower,
  multiplyLowerByTranspose,
  multiplyTransposeByLower,
} from '../linalg/triangular';
import { invertSpd } from '../design/spd-inverse';

export interface WishartWorkspace {
  K: number;
  psiInv: Float64Array;
  chol: Float64Array;
  bartlett: Float64Array;
  product: Float64Array;
  productInv: Float64Array;
}

export function createWishartWorkspace(K: number): WishartWorkspace {
  const m = () => new Float64Array(K * K);
  return { K, psiInv: m(), chol: m(), bartlett: m(), product: m(), productInv: m() };
}

/**
 * Writes a draw of Σ ~ IW(ν, Ψ) into `sigma` and its inverse into `sigmaInv` (both K×K).
 * Returns false if Ψ is not numerically positive definite.
 */
export function drawInverseWishart(
  nu: number,
  psi: Float64Array,
  prng: Prng,
  sigma: Float64Array,
  sigmaInv: Float64Array,
  ws: WishartWorkspace,
): boolean {
  const { K, psiInv, chol, bartlett, product, productInv } = ws;
  if (invertSpd(K, psi, 0, psiInv, 0, product) === -Infinity) return false;
  if (!choleskyDecompose(psiInv, K, chol)) return false;
  bartlett.fill(0);
  for (let i = 0; i < K; i++) {
    bartlett[i * K + i] = Math.sqrt(drawChiSquare(nu - i, prng));
    for (let j = 0; j < i; j++) bartlett[i * K + j] = drawStandardNormal(prng);
  }
  multiplyLower(chol, bartlett, K, product);
  multiplyLowerByTranspose(product, K, sigmaInv);
  invertLower(product, K, productInv);
  multiplyTransposeByLower(productInv, K, sigma);
  return true;
}
