/**
 * D-efficiency of a main-effects choice design at β = 0 relative to the optimum of Street &
 * Burgess (Street & Burgess 2007, *The Construction of Optimal Stated Choice Experiments*;
 * Burgess & Street 2005, JSPI 134:288-301) [M formula; docs/methods.md "Design check values"]:
 *   C = B Λ B' with B the orthonormal main-effect contrasts over all L = Π l_q profiles;
 *   det C_opt = Π_q [2 l_q S_q / (m² (l_q − 1) L)]^(l_q − 1),
 *   S_q = (m² − Σ_u n_u²)/2 with the m alternatives spread as evenly as possible over l_q levels;
 *   efficiency = (det C / det C_opt)^(1/p), p = Σ (l_q − 1).
 * C is computed as the MNL information at β = 0 of the design coded with normalised Helmert
 * contrasts scaled by sqrt(l_q/L), divided by the number of tasks N (at β = 0,
 * (1/m) Σ_j (x_j − x̄)(x_j − x̄)' = (1/m²) Σ_{i<j} (x_i − x_j)(x_i − x_j)', which is Λ's form).
 */
import type { CodingPlan } from '../../../../shared/engine/coding/coding-plan';
import { getSpdLogDet } from '../../linalg/cholesky';
import type { LevelGrid } from '../design-grid';
import { computeInformationMatrix } from '../mnl-information';
import type { StreetBurgessEfficiency } from '../../../../shared/schemas/design-diagnostics';

/** S_q: most pairs of m alternatives that can differ on an attribute with l levels. */
export function getMaxDifferingPairs(l: number, m: number): number {
  const x = Math.floor(m / l);
  const y = m % l;
  // y levels are used x+1 times, l − y levels x times.
  const sumSquares = y * (x + 1) ** 2 + (l - y) * x * x;
  return (m * m - sumSquares) / 2;
}

/** det C_opt for main effects (see the file comment). */
export function getStreetBurgessOptimalDet(levelCounts: number[], m: number): number {
  const L = levelCounts.reduce((p, l) => p * l, 1);
  return levelCounts.reduce((det, l) => {
    const S = getMaxDifferingPairs(l, m);
    return det * ((2 * l * S) / (m * m * (l - 1) * L)) ** (l - 1);
  }, 1);
}

/**
 * Efficiency of an unlabeled design without opt-out / status quo; null when the reference
 * does not apply (constants, or a linear attribute with more than 2 levels).
 */
export function computeStreetBurgessEfficiency(
  plan: CodingPlan,
  grid: LevelGrid,
): StreetBurgessEfficiency | null {
  if (plan.fixed || plan.constantColumn.some((c) => c >= 0)) return null;
  const levelCounts = plan.attributes.map((a) => a.levelIds.length);
  if (plan.attributes.some((a, q) => a.width !== levelCounts[q] - 1)) return null;
  const L = levelCounts.reduce((p, l) => p * l, 1);
  const p = levelCounts.reduce((s, l) => s + l - 1, 0);
  const { S, J, A } = grid;
  const x = new Float64Array(S * J * p);
  for (let r = 0; r < S * J; r++) {
    let col = 0;
    for (let a = 0; a < A; a++) {
      const l = levelCounts[a];
      const level = grid.levels[r * A + a];
      const scale = Math.sqrt(l / L);
      // Normalised Helmert contrast k: (1, …, 1, −k, 0, …)/sqrt(k(k+1)).
      for (let k = 1; k < l; k++) {
        const v = level < k ? 1 : level === k ? -k : 0;
        x[r * p + col] = (v / Math.sqrt(k * (k + 1))) * scale;
        col++;
      }
    }
  }
  const info = new Float64Array(p * p);
  computeInformationMatrix(
    p,
    S,
    J,
    x,
    new Float64Array(p),
    info,
    new Float64Array(J * (p + 1) + p),
  );
  const logDet = getSpdLogDet(info, p, new Float64Array(p * p));
  const detC = logDet === -Infinity ? 0 : Math.exp(logDet - p * Math.log(S));
  const detOptimal = getStreetBurgessOptimalDet(levelCounts, J);
  // Ratio in logs: both determinants can be tiny for many attributes.
  const logRatio = logDet - p * Math.log(S) - Math.log(detOptimal);
  return { detC, detOptimal, efficiency: logDet === -Infinity ? 0 : Math.exp(logRatio / p) };
}
