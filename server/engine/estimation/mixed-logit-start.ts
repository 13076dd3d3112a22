/**
 * Starting values for the mixed logit from the MNL (Train 2009 §10.2 practice): locations
 * at the MNL coefficients (log of the magnitude for (negative) lognormals), spreads at
 * half the magnitude (at least 0.1), Cholesky off-diagonals at zero. Extra starts perturb
 * these with seeded normal noise. Called on internally scaled data (parameter-scaling.ts), so
 * the 0.01 floor of a lognormal's magnitude is relative to the column's spread, not its units.
 * In WTP space the MNL gives the cost and the ratios w_k = −β_k/β_cost (Train & Weeks 2005).
 */
import { inverseNormal } from '../draws/inverse-normal';
import { createPrng } from '../draws/prng';
import { DIST_LOGNORMAL, DIST_NEG_LOGNORMAL, type MixedLogitLayout } from './mixed-logit-layout';

/** θ0 from MNL coefficients `mnl` (one per layout coefficient). */
export function getMixedLogitStart(
  layout: MixedLogitLayout,
  mnlCoefficients: ArrayLike<number>,
): Float64Array {
  const theta = new Float64Array(layout.P);
  const mnl = Float64Array.from(mnlCoefficients);
  const c = layout.wtpCost;
  if (c >= 0) {
    // The cost's sign is fixed by its distribution; its magnitude at least 0.01.
    const sign =
      layout.dist[c] === DIST_LOGNORMAL
        ? 1
        : layout.dist[c] === DIST_NEG_LOGNORMAL
          ? -1
          : Math.sign(mnl[c]) || -1;
    const cost = sign * Math.max(Math.abs(mnl[c]), 1e-2);
    for (let k = 0; k < layout.K; k++) if (k !== c) mnl[k] = -mnl[k] / cost;
    mnl[c] = cost;
  }
  for (let k = 0; k < layout.K; k++) {
    const b = mnl[k];
    const code = layout.dist[k];
    if (code === DIST_LOGNORMAL) theta[layout.meanIndex[k]] = Math.log(Math.max(b, 1e-2));
    else if (code === DIST_NEG_LOGNORMAL) theta[layout.meanIndex[k]] = Math.log(Math.max(-b, 1e-2));
    else theta[layout.meanIndex[k]] = b;
    const spread =
      code === DIST_LOGNORMAL || code === DIST_NEG_LOGNORMAL
        ? 0.5
        : Math.max(0.1, 0.5 * Math.abs(b));
    if (layout.spreadIndex[k] >= 0) theta[layout.spreadIndex[k]] = spread;
  }
  const B = layout.block.length;
  for (let i = 0; i < B; i++) {
    theta[layout.cholIndex[i * B + i]] = Math.max(0.1, 0.5 * Math.abs(mnl[layout.block[i]]));
  }
  return theta;
}

/** Start number `index` (≥ 1): θ0 plus N(0, (0.5·max(|θ0_p|, 0.2))²) noise, seeded. */
export function perturbStart(theta0: Float64Array, index: number, seed: number): Float64Array {
  const prng = createPrng(seed, 0x5747 + index);
  return theta0.map((v) => v + 0.5 * Math.max(Math.abs(v), 0.2) * inverseNormal(prng.nextDouble()));
}
