/**
 * Turns uniform panel draws into the standard variates each random coefficient needs:
 * Φ⁻¹(u) by AS241 for normal and lognormal coefficients, the inverse CDF of the symmetric
 * triangular distribution on [−1, 1] (t = √(2u) − 1 for u < ½, else 1 − √(2(1 − u))) and
 * 2u − 1 for the uniform (Train 2009 §9.2.1, inverse-CDF transformation).
 *
 * Variates are kept in single precision: 4 bytes instead of 8 per draw halves the memory
 * that grows as N·R·D (the largest array of a big model) and the kernels' memory traffic.
 * The rounding (relative 6e-8) is far below the simulation error of R draws (order 1/√R for
 * pseudo-random, 1/R for quasi-random draws; Train 2009 §9.3), and both kernels read the
 * same stored values. Each draw row is padded to a whole number of the WebAssembly kernel's
 * draw blocks (getDrawStride); padding holds zeros.
 */
import { inverseNormal } from '../draws/inverse-normal';
import { fillUniformDraws, type DrawsSpec } from '../draws/uniform-draws';
import { DRAW_BLOCK } from '../simd/arena-header';
import { DIST_TRIANGULAR, DIST_UNIFORM } from './distribution-codes';
import type { MixedLogitLayout } from './mixed-logit-layout';

/** Distance between two draw rows: R rounded up to a multiple of the kernel's draw block. */
export function getDrawStride(R: number): number {
  return Math.ceil(R / DRAW_BLOCK) * DRAW_BLOCK;
}

/** Respondents whose uniform draws are generated at once (bounds the Float64 scratch). */
const FILL_BLOCK = 16;

/**
 * Writes the standard variates of respondents first..first+count−1 into `out`, layout
 * [respondent][dimension][stride] (dimension = layout.dimension[k] of each random
 * coefficient k). The uniform draws are generated FILL_BLOCK respondents at a time, so no
 * double-precision copy of the whole slice ever exists.
 */
export function fillStandardVariates(
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  first: number,
  count: number,
  out: Float32Array,
): void {
  const { D } = layout;
  const R = draws.count;
  const stride = getDrawStride(R);
  if (out.length < count * D * stride) throw new RangeError('variates buffer too small');
  if (D === 0) return;
  const kind = new Int8Array(D);
  for (let k = 0; k < layout.K; k++)
    if (layout.dimension[k] >= 0) kind[layout.dimension[k]] = layout.dist[k];
  const uniform = new Float64Array(Math.min(FILL_BLOCK, count) * D * R);
  for (let b = 0; b < count; b += FILL_BLOCK) {
    const m = Math.min(FILL_BLOCK, count - b);
    fillUniformDraws({ ...draws, dimensions: D }, first + b, m, uniform);
    for (let i = 0; i < m; i++) {
      for (let d = 0; d < D; d++) {
        const src = (i * D + d) * R;
        const dst = ((b + i) * D + d) * stride;
        for (let r = 0; r < R; r++) {
          const u = uniform[src + r];
          out[dst + r] =
            kind[d] === DIST_TRIANGULAR
              ? u < 0.5
                ? Math.sqrt(2 * u) - 1
                : 1 - Math.sqrt(2 * (1 - u))
              : kind[d] === DIST_UNIFORM
                ? 2 * u - 1
                : inverseNormal(u);
        }
        out.fill(0, dst + R, dst + stride);
      }
    }
  }
}

/** Allocates and fills the standard variates of respondents first..first+count−1. */
export function createStandardVariates(
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  first: number,
  count: number,
): Float32Array {
  const out = new Float32Array(Math.max(1, count * layout.D * getDrawStride(draws.count)));
  fillStandardVariates(layout, draws, first, count, out);
  return out;
}
