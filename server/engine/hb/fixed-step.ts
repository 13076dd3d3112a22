/**
 * The fixed-coefficient layer of the HB sampler (Train 2009, §12.7): the coefficients shared by
 * all respondents move by one random-walk MH step per iteration, proposal f + ρ_f·C·z with C the
 * Cholesky factor of their MNL covariance, prior N(m₀, v₀) per coefficient (the same as μ's),
 * accepted on the product of all respondents' likelihoods given their current α_n.
 */
import { drawStandardNormal } from '../draws/gamma-variate';
import type { Prng } from '../draws/prng';
import type { CheckedHbOptions, HbLayout } from './check-hb-options';
import type { IndividualStep } from './individual-step';

export function createFixedStep(
  layout: HbLayout,
  chol: Float64Array,
  priors: CheckedHbOptions['priors'],
) {
  const Kf = layout.fixed.length;
  const candidate = new Float64Array(Kf);
  const z = new Float64Array(Kf);
  let rho = 1;
  const logPrior = (f: Float64Array) => {
    let s = 0;
    for (let k = 0; k < Kf; k++) s -= (f[k] - priors.muMean) ** 2;
    return s / (2 * priors.muVariance);
  };
  return {
    /** One MH step; returns whether the proposal was accepted. */
    step(individual: IndividualStep, prng: Prng): boolean {
      const current = individual.fixedAlpha;
      for (let k = 0; k < Kf; k++) z[k] = drawStandardNormal(prng);
      for (let i = 0; i < Kf; i++) {
        let s = 0;
        for (let j = 0; j <= i; j++) s += chol[i * Kf + j] * z[j];
        candidate[i] = current[i] + rho * s;
      }
      const llOld = individual.totalLoglik();
      const llNew = individual.proposeFixed(candidate);
      const logRatio = llNew - llOld + logPrior(candidate) - logPrior(current);
      if (!(Math.log(prng.nextDouble()) < logRatio)) return false;
      individual.acceptFixed();
      return true;
    },
    /** Burn-in adaptation toward acceptance 0.3: E[log change] = 0 at that rate. */
    adapt(accepted: boolean): void {
      rho *= Math.exp(0.1 * ((accepted ? 1 : 0) - 0.3));
    },
  };
}
