/**
 * Hessian by central differences of an analytic gradient (Nocedal & Wright 2006 §8.1,
 * eq. 8.7 applied to ∇f), symmetrised as (H + Hᵀ)/2, with a relative step
 * h_i = 1e-5·max(|θ_i|, 0.1) that shrinks with small parameters (on the internally scaled
 * parameters, where 0.1 is small against any standard error; Dennis & Schnabel 1983 §5.6).
 * Costs 2P gradient evaluations. The same evaluations cross-check the analytic gradient: by the
 * trapezoid rule, (f(θ+h e_i) − f(θ−h e_i)) / 2h must equal (g_i(θ+h e_i) + g_i(θ−h e_i)) / 2 up
 * to O(h²); the largest discrepancy, relative to h·|H_ii| + |g_i|, is returned.
 */
export interface NumericalHessian {
  hessian: Float64Array;
  /** Largest relative disagreement between analytic gradient and the finite differences of f. */
  gradientCheck: number;
}

export async function computeNumericalHessian(
  gradientAt: (theta: Float64Array, grad: Float64Array) => Promise<number>,
  theta: Float64Array,
): Promise<NumericalHessian> {
  const P = theta.length;
  const H = new Float64Array(P * P);
  const x = Float64Array.from(theta);
  const gPlus = new Float64Array(P);
  const gMinus = new Float64Array(P);
  let gradientCheck = 0;
  for (let j = 0; j < P; j++) {
    const h = 1e-5 * Math.max(Math.abs(theta[j]), 0.1);
    x[j] = theta[j] + h;
    const fPlus = await gradientAt(x, gPlus);
    x[j] = theta[j] - h;
    const fMinus = await gradientAt(x, gMinus);
    x[j] = theta[j];
    for (let i = 0; i < P; i++) H[i * P + j] = (gPlus[i] - gMinus[i]) / (2 * h);
    const slopeF = (fPlus - fMinus) / (2 * h);
    const slopeG = (gPlus[j] + gMinus[j]) / 2;
    const size = h * Math.abs(H[j * P + j]) + Math.abs(slopeG) + 1e-300;
    gradientCheck = Math.max(gradientCheck, Math.abs(slopeF - slopeG) / size);
  }
  for (let i = 0; i < P; i++)
    for (let j = 0; j < i; j++) {
      const v = (H[i * P + j] + H[j * P + i]) / 2;
      H[i * P + j] = v;
      H[j * P + i] = v;
    }
  return { hessian: H, gradientCheck };
}
