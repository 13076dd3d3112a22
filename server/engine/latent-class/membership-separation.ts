/**
 * Quasi-separation of the latent class membership model. When a background answer sorts the
 * respondents into a class with (near) certainty — say every respondent who answered "yes" is in
 * class 2 — the membership MNL has no finite maximum: its coefficient grows without bound while
 * the log-likelihood creeps toward its supremum, and the information matrix becomes singular
 * (Albert & Anderson 1984, Biometrika 71:1-10, for the logit; the same holds for the membership
 * MNL fitted on the posteriors). We call a coefficient run off when it moves a class's odds by
 * more than e^RUN_OFF across the answer's observed range: the fitted membership probabilities
 * of one group are then 0 or 1 to within e^−RUN_OFF ≈ 5e-7, far beyond what a sample of this
 * size can estimate (common practice, no source; the limit is ours). Such coefficients get no
 * standard error; the others' come from the observed information with the run-off ones held at
 * their values (the rows and columns of the information left out), and the run carries a
 * warning naming the answers.
 */
import { invertMatrix } from '../linalg/invert-matrix';
import type { LatentClassState } from './latent-class-state';

const RUN_OFF = 15;

export interface RunOffCoefficient {
  /** Class (1-based; class 1 is the reference and has none). */
  class: number;
  /** Covariate name. */
  name: string;
  estimate: number;
  /** Index in θ = (β_1..β_C, γ). */
  parameter: number;
}

/** Membership coefficients of covariates (not the constants) that ran off. */
export function findRunOffMembership(
  state: LatentClassState,
  z: Float64Array,
  N: number,
  names: readonly string[],
): RunOffCoefficient[] {
  const { C, K, Mp, gamma } = state;
  const out: RunOffCoefficient[] = [];
  for (let m = 1; m < Mp; m++) {
    let low = Infinity;
    let high = -Infinity;
    for (let n = 0; n < N; n++) {
      low = Math.min(low, z[n * Mp + m]);
      high = Math.max(high, z[n * Mp + m]);
    }
    for (let c = 1; c < C; c++) {
      const g = gamma[(c - 1) * Mp + m];
      if (!(Math.abs(g) * (high - low) <= RUN_OFF))
        out.push({
          class: c + 1,
          name: names[m - 1],
          estimate: g,
          parameter: C * K + (c - 1) * Mp + m,
        });
    }
  }
  return out;
}

/**
 * Inverse of the observed information I = −H (P × P) with the parameters in `left` left out:
 * their rows and columns are NaN. Null when the rest is singular too.
 */
export function invertInformationWithout(
  hess: Float64Array,
  P: number,
  left: readonly number[],
): Float64Array | null {
  const keep = [...Array(P).keys()].filter((p) => !left.includes(p));
  const Q = keep.length;
  const sub = new Float64Array(Q * Q);
  keep.forEach((a, i) => keep.forEach((b, j) => (sub[i * Q + j] = -hess[a * P + b])));
  const inv = invertMatrix(sub, Q);
  if (!inv) return null;
  for (let i = 0; i < Q; i++) if (!(inv[i * Q + i] > 0)) return null;
  const out = new Float64Array(P * P).fill(NaN);
  keep.forEach((a, i) => keep.forEach((b, j) => (out[a * P + b] = inv[i * Q + j])));
  return out;
}
