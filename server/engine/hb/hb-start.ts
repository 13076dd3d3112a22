/**
 * Starting values of the HB chains: the MNL estimates, on the α scale of each coefficient
 * (ln |β| for the lognormal ones), and for chains after the first an overdispersed jitter of
 * the start, z·(2·SE + 0.1·|α|), so split R-hat can reveal chains that have not met (Gelman &
 * Rubin 1992; the size of the jitter is common practice, no source). The MNL covariance of the
 * fixed coefficients shapes their random-walk proposal.
 */
import { drawStandardNormal } from '../draws/gamma-variate';
import { createPrng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import type { ChoiceData } from '../estimation/choice-data';
import { fitMnl } from '../estimation/fit-mnl';
import { HB_LOGNORMAL, HB_NEG_LOGNORMAL, type HbLayout } from './check-hb-options';

export interface HbStart {
  /** α of every coefficient (length K, coefficient order). */
  alpha: Float64Array;
  /** Cholesky factor of the MNL covariance of the fixed coefficients (Kf × Kf). */
  fixedChol: Float64Array;
  /** LL of the MNL at its estimate. */
  mnlLoglik: number;
}

/** MNL-based start on data whose columns are the coefficients in order. */
export async function getHbStart(
  data: ChoiceData,
  layout: HbLayout,
  chain: number,
  seed: number,
): Promise<HbStart> {
  const fit = await fitMnl(data);
  const covariance = fit.inference.classical;
  const { K, transform, fixed } = layout;
  const alpha = new Float64Array(K);
  const se = new Float64Array(K);
  for (let k = 0; k < K; k++) {
    const b = fit.estimates[k];
    const s = Number.isFinite(fit.se[k]) ? fit.se[k] : 0;
    if (transform[k] === HB_LOGNORMAL || transform[k] === HB_NEG_LOGNORMAL) {
      const signed = transform[k] === HB_LOGNORMAL ? b : -b;
      const magnitude = Math.max(signed, 0.01 * Math.abs(b), 1e-8);
      alpha[k] = Math.log(magnitude);
      se[k] = Math.min(s / magnitude, 2);
    } else {
      alpha[k] = b;
      se[k] = s;
    }
  }
  if (chain > 0) {
    const prng = createPrng(seed, 0x5354 + chain);
    for (let k = 0; k < K; k++)
      alpha[k] += drawStandardNormal(prng) * (2 * se[k] + 0.1 * Math.abs(alpha[k]));
  }
  const Kf = fixed.length;
  const block = new Float64Array(Kf * Kf);
  for (let i = 0; i < Kf; i++)
    for (let j = 0; j < Kf; j++)
      block[i * Kf + j] = covariance ? covariance[fixed[i] * K + fixed[j]] : 0;
  const fixedChol = new Float64Array(Kf * Kf);
  if (Kf > 0 && !choleskyDecompose(block, Kf, fixedChol))
    for (let i = 0; i < Kf; i++) fixedChol[i * Kf + i] = 0.1;
  return { alpha, fixedChol, mnlLoglik: fit.loglik };
}
