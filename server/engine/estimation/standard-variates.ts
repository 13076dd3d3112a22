/**
 * Turns uniform panel draws into the standard variates each random coefficient needs:
 * Φ⁻¹(u) by AS241 for normal and lognormal coefficients, the inverse CDF of the symmetric
 * triangular distribution on [−1, 1] (t = √(2u) − 1 for u < ½, else 1 − √(2(1 − u))) and
 * 2u − 1 for the uniform (Train 2009 §9.2.1, inverse-CDF transformation).
 */
import { inverseNormal } from '../draws/inverse-normal';
import { fillUniformDraws, type DrawsSpec } from '../draws/uniform-draws';
import { DIST_TRIANGULAR, DIST_UNIFORM, type MixedLogitLayout } from './mixed-logit-layout';

/**
 * Standard variates for respondents first..first+count−1, layout [respondent][dimension][draw]
 * (dimension = layout.dimension[k] of each random coefficient k).
 */
export function createStandardVariates(
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  first: number,
  count: number,
): Float64Array {
  const { D } = layout;
  const R = draws.count;
  const out = new Float64Array(Math.max(1, count * D * R));
  if (D === 0) return out;
  fillUniformDraws({ ...draws, dimensions: D }, first, count, out);
  const kind = new Int8Array(D);
  for (let k = 0; k < layout.K; k++)
    if (layout.dimension[k] >= 0) kind[layout.dimension[k]] = layout.dist[k];
  for (let n = 0; n < count; n++) {
    for (let d = 0; d < D; d++) {
      const base = (n * D + d) * R;
      for (let r = 0; r < R; r++) {
        const u = out[base + r];
        out[base + r] =
          kind[d] === DIST_TRIANGULAR
            ? u < 0.5
              ? Math.sqrt(2 * u) - 1
              : 1 - Math.sqrt(2 * (1 - u))
            : kind[d] === DIST_UNIFORM
              ? 2 * u - 1
              : inverseNormal(u);
      }
    }
  }
  return out;
}
