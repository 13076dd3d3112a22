/**
 * One name per design criterion everywhere on the Tasks screen: the MNL D-error at zero priors
 * (D₀), at fixed priors (Dp) and averaged over Bayesian prior draws (Db).
 */
import type { DesignPriors } from '@shared/schemas/design-spec';

export const criterionNames: Record<DesignPriors['kind'], string> = {
  zero: 'D₀-error (zero priors)',
  fixed: 'Dp-error (fixed priors)',
  bayesian: 'Db-error (Bayesian priors)',
};
