/**
 * Pilot → priors → redesign: turning a finished run into Bayesian priors for a new design, the
 * candidate design generated beside the current one, and adopting or discarding it.
 */
import { z } from 'zod';
import { studyParamsSchema } from './study-params';
import type { DesignCriterion, DesignPriors } from './design-spec';

/**
 * Where a prior's SD comes from: the standard error of the estimated mean ('se'), or for a
 * mixed logit the population SD of the random coefficient ('population'; fixed coefficients
 * keep their standard error).
 */
export const priorSpreadSchema = z.enum(['se', 'population']);
export type PriorSpread = z.infer<typeof priorSpreadSchema>;

export const runPriorsQuerySchema = z.object({
  runId: z.uuid('Choose a finished run'),
  spread: priorSpreadSchema.default('se'),
});
export type RunPriorsQuery = z.infer<typeof runPriorsQuerySchema>;

export const candidateParamsSchema = studyParamsSchema.extend({
  designId: z.uuid('Unknown design'),
});

/** One coded column's prior and what it was taken from. */
export type RunPriorColumn = {
  key: string;
  name: string;
  coefficient: string;
  mean: number;
  sd: number;
  /** 'se' or 'population' as asked; 'se' for a fixed coefficient of a mixed logit. */
  spreadFrom: PriorSpread;
};

export type RunPriors = {
  runId: string;
  runName: string;
  model: 'mnl' | 'mixed';
  spread: PriorSpread;
  /** Ready for the design spec (Bayesian normal priors, 200 draws). */
  priors: Extract<DesignPriors, { kind: 'bayesian' }>;
  columns: RunPriorColumn[];
};

/** One criterion of the current and of the candidate design, both under the NEW priors. */
export type CriterionComparison = {
  criterion: DesignCriterion;
  current: number | null;
  candidate: number | null;
  unavailable: string | null;
};
