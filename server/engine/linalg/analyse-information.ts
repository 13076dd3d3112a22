/**
 * Analysis of an information matrix A (the negative Hessian of a log-likelihood, or the BHHH
 * outer product) in correlation form C = D^{-1/2} A D^{-1/2}, D = diag(A): unlike a pivot test
 * on A itself, C does not change when a parameter is measured in other units, so "singular"
 * means collinear and not "large numbers" (Belsley, Kuh & Welsch 1980, ch. 3, scale the columns
 * before judging conditioning). From the symmetric eigen-decomposition of C it gives the
 * condition number, whether A is positive definite, the directions that are not (named by their
 * largest components), and the inverse of A, or the pseudo-inverse on the well-determined
 * eigen-directions when some are not.
 */
import { decomposeSymmetric } from './symmetric-eigen';

/** Eigenvalues of C below this share of the largest count as zero (condition number 1e10). */
export const SINGULAR_RELATIVE = 1e-10;

export interface WeakDirection {
  eigenvalue: number;
  /** Parameter indexes and loadings (unit-length eigenvector of C), largest first, |loading| ≥ 0.1. */
  loadings: { index: number; loading: number }[];
}

export interface InformationAnalysis {
  positiveDefinite: boolean;
  conditionNumber: number;
  /** Directions of C with eigenvalue ≤ SINGULAR_RELATIVE·λ_max, smallest first. */
  weak: WeakDirection[];
  /** A⁻¹ when positive definite; otherwise the pseudo-inverse on the strong eigen-directions. */
  inverse: Float64Array;
  /** Per parameter: true when it loads (≥ 0.01) on a weak direction, so its variance is unknown. */
  undetermined: boolean[];
}

export function analyseInformation(a: Float64Array, n: number): InformationAnalysis {
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = a[i * n + i];
    d[i] = v > 0 && Number.isFinite(v) ? 1 / Math.sqrt(v) : 1;
  }
  const c = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) c[i * n + j] = a[i * n + j] * d[i] * d[j];
  const finite = c.every(Number.isFinite);
  const { values, vectors } = finite
    ? decomposeSymmetric(c, n)
    : { values: new Float64Array(n).fill(NaN), vectors: new Float64Array(n * n) };
  const top = Math.max(...values.map(Math.abs));
  const threshold = SINGULAR_RELATIVE * top;
  const weak: WeakDirection[] = [];
  const undetermined = new Array<boolean>(n).fill(!finite);
  const inverse = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const lambda = values[i];
    if (!(lambda > threshold)) {
      const loadings: { index: number; loading: number }[] = [];
      for (let r = 0; r < n; r++) {
        const v = vectors[r * n + i];
        if (Math.abs(v) >= 0.01) undetermined[r] = true;
        if (Math.abs(v) >= 0.1) loadings.push({ index: r, loading: v });
      }
      loadings.sort((x, y) => Math.abs(y.loading) - Math.abs(x.loading));
      weak.push({ eigenvalue: lambda, loadings });
      continue;
    }
    // A⁻¹ = D^{1/2}... : C⁻¹ = Σ v v'/λ over strong directions, then A⁻¹ = D^{-1/2} C⁻¹ D^{-1/2}.
    for (let r = 0; r < n; r++) {
      const vr = vectors[r * n + i] / lambda;
      if (vr === 0) continue;
      for (let s = 0; s < n; s++) inverse[r * n + s] += vr * vectors[s * n + i] * d[r] * d[s];
    }
  }
  return {
    positiveDefinite: finite && weak.length === 0,
    conditionNumber: finite && values[0] > 0 ? values[n - 1] / values[0] : Infinity,
    weak,
    inverse,
    undetermined,
  };
}

/** "0.71·a − 0.70·b" from a weak direction and the parameter names. */
export function describeDirection(direction: WeakDirection, names: readonly string[]): string {
  return direction.loadings
    .map(({ index, loading }, i) => {
      const sign = loading < 0 ? '−' : i === 0 ? '' : '+';
      return `${i === 0 ? sign : ` ${sign} `}${Math.abs(loading).toFixed(2)}·${names[index]}`;
    })
    .join('');
}
