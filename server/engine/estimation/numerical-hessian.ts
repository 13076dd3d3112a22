/**
 * Hessian by central differences of an analytic gradient (Nocedal & Wright 2006 §8.1,
 * eq. 8.7 applied to ∇f), step h_i = 1e-5·max(1, |θ_i|), symmetrised as (H + Hᵀ)/2.
 * Costs 2P gradient evaluations.
 */
export async function computeNumericalHessian(
  gradientAt: (theta: Float64Array, grad: Float64Array) => Promise<number>,
  theta: Float64Array,
): Promise<Float64Array> {
  const P = theta.length;
  const H = new Float64Array(P * P);
  const x = Float64Array.from(theta);
  const gPlus = new Float64Array(P);
  const gMinus = new Float64Array(P);
  for (let j = 0; j < P; j++) {
    const h = 1e-5 * Math.max(1, Math.abs(theta[j]));
    x[j] = theta[j] + h;
    await gradientAt(x, gPlus);
    x[j] = theta[j] - h;
    await gradientAt(x, gMinus);
    x[j] = theta[j];
    for (let i = 0; i < P; i++) H[i * P + j] = (gPlus[i] - gMinus[i]) / (2 * h);
  }
  for (let i = 0; i < P; i++)
    for (let j = 0; j < i; j++) {
      const v = (H[i * P + j] + H[j * P + i]) / 2;
      H[i * P + j] = v;
      H[j * P + i] = v;
    }
  return H;
}
