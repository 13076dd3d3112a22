/**
 * The MNL in WTP space (Train & Weeks 2005) as an exact reparameterisation of the fitted
 * preference-space MNL: by the invariance of maximum likelihood, w_k = −β_k/β_cost and β_cost
 * maximise the same likelihood, and their covariance is J Σ J′ with J = ∂(w, β_cost)/∂β
 * (Greene 2018 §4.6); the gradient maps as g_w = (∂β/∂θ)′ g_β. The LL does not change.
 */
import type { Inference } from './inference';

function transform(cov: Float64Array | null, J: Float64Array, P: number): Float64Array | null {
  if (!cov) return null;
  const out = new Float64Array(P * P);
  for (let i = 0; i < P; i++)
    for (let j = 0; j < P; j++) {
      let s = 0;
      for (let a = 0; a < P; a++) {
        const jia = J[i * P + a];
        if (jia === 0) continue;
        for (let b = 0; b < P; b++) s += jia * cov[a * P + b] * J[j * P + b];
      }
      out[i * P + j] = s;
    }
  return out;
}

const diagonalSqrt = (cov: Float64Array | null, P: number) =>
  Float64Array.from({ length: P }, (_, p) =>
    cov && cov[p * P + p] >= 0 ? Math.sqrt(cov[p * P + p]) : NaN,
  );

export function toWtpSpace(
  beta: Float64Array,
  gradient: Float64Array,
  inference: Inference,
  cost: number,
): { theta: Float64Array; gradient: Float64Array; inference: Inference } {
  const P = beta.length;
  const bc = beta[cost];
  const theta = beta.map((b, k) => (k === cost ? b : -b / bc));
  const J = new Float64Array(P * P);
  J[cost * P + cost] = 1;
  for (let k = 0; k < P; k++) {
    if (k === cost) continue;
    J[k * P + k] = -1 / bc;
    J[k * P + cost] = beta[k] / (bc * bc);
  }
  const g = new Float64Array(P);
  g[cost] = gradient[cost];
  for (let k = 0; k < P; k++) {
    if (k === cost) continue;
    g[k] = -bc * gradient[k];
    g[cost] -= theta[k] * gradient[k];
  }
  const classical = transform(inference.classical, J, P);
  const robust = transform(inference.robust, J, P);
  return {
    theta,
    gradient: g,
    inference: {
      ...inference,
      classical,
      robust,
      se: diagonalSqrt(classical, P),
      robustSe: diagonalSqrt(robust, P),
      chosen: inference.used === 'robust' ? robust : classical,
    },
  };
}
