/**
 * One name per design criterion everywhere on the Tasks screen: the MNL D-error at zero priors
 * (D₀), at fixed priors (Dp) and averaged over Bayesian prior draws (Db), and the four
 * criteria a search can minimise, each with a one-line explanation (docs/methods.md,
 * "Design criteria").
 */
import type { DesignCriterion, DesignPriors } from '@shared/schemas/design-spec';

export const criterionNames: Record<DesignPriors['kind'], string> = {
  zero: 'D₀-error (zero priors)',
  fixed: 'Dp-error (fixed priors)',
  bayesian: 'Db-error (Bayesian priors)',
};

export const searchCriteria: Record<DesignCriterion, { name: string; explanation: string }> = {
  d_error: {
    name: 'D-error',
    explanation: 'Overall precision of all coefficients together (determinant); lower is better.',
  },
  a_error: {
    name: 'A-error',
    explanation: 'Average variance of the coefficients (trace of the covariance ÷ parameters).',
  },
  s_estimate: {
    name: 'S-estimate',
    explanation:
      'Design replications until every coefficient with a non-zero prior reaches the chosen t-value.',
  },
  c_error: {
    name: 'C-error',
    explanation:
      'Sum of the variances of every attribute’s willingness to pay (needs a cost prior).',
  },
};
