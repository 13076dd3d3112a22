/**
 * The parts of an estimation run's specification and result that concern how far it can be
 * trusted: optimiser settings and the covariance choice (spec), and the convergence verdict,
 * warnings, covariance matrices, derived quantities, fit against the constants-only model and
 * simulation noise (result). Kept apart from estimation-spec.ts so model families can grow there.
 */
import { z } from 'zod';

/** Optimiser and inference settings of a run (all optional, with documented defaults). */
export const estimationSettingsSchema = z.object({
  /** Iterations allowed per start (default 100 for the MNL, 300 for the mixed logit). */
  maxIterations: z.number().int().min(1).max(10_000).optional(),
  /** Newton decrement g′A⁻¹g at convergence. */
  tolerance: z.number().positive().max(1).default(1e-7),
  /** Largest relative gradient at convergence (ε^{1/3}). */
  gradientTolerance: z.number().positive().max(1).default(6.055454452393343e-6),
  /** Which covariance the intervals, WTP and derived quantities use; 'bhhh' skips the Hessian. */
  covariance: z.enum(['robust', 'classical', 'bhhh']).default('robust'),
  /** Re-estimate with 3 more draw seeds and report the spread of each estimate. */
  simulationCheck: z.boolean().default(false),
});
export type EstimationSettings = z.output<typeof estimationSettingsSchema>;

export const convergenceStatusSchema = z.enum(['converged', 'stalled', 'iteration_limit']);

export const estimationWarningSchema = z.object({
  code: z.string(),
  message: z.string(),
  parameters: z.array(z.string()).optional(),
  tasks: z.array(z.string()).optional(),
});
export type EstimationWarningResult = z.infer<typeof estimationWarningSchema>;

/** Matrix rows with null where a value is unknown (a parameter without a standard error). */
const matrixSchema = z.array(z.array(z.number().nullable()));

export const covarianceResultSchema = z.object({
  names: z.array(z.string()),
  /** 'hessian': inverse −Hessian; 'bhhh': inverse outer product of scores. */
  method: z.enum(['hessian', 'bhhh']),
  /** The one the intervals use. */
  used: z.enum(['classical', 'robust']),
  classical: matrixSchema.nullable(),
  robust: matrixSchema.nullable(),
  /** Respondents (clusters) and the G/(G−1) factor applied to the robust one. */
  clusters: z.number().int(),
  correction: z.number(),
});
export type CovarianceResult = z.infer<typeof covarianceResultSchema>;

export const convergenceDetailSchema = z.object({
  status: convergenceStatusSchema,
  decrement: z.number().nullable(),
  maxRelativeGradient: z.number(),
  gradient: z.array(z.object({ name: z.string(), value: z.number(), relative: z.number() })),
  tolerance: z.number(),
  gradientTolerance: z.number(),
  maxIterations: z.number().int(),
  starts: z.number().int(),
  startsAtBest: z.number().int(),
  startLoglik: z.array(z.number()),
  newtonSteps: z.number().int(),
  gradientCheck: z.number().nullable(),
});

/** An interval by the delta method and by simulation (Krinsky & Robb 1986). */
export const intervalEstimateSchema = z.object({
  estimate: z.number(),
  se: z.number().nullable(),
  deltaLower: z.number().nullable(),
  deltaUpper: z.number().nullable(),
  simulatedSe: z.number().nullable(),
  lower: z.number().nullable(),
  upper: z.number().nullable(),
});
export type IntervalEstimate = z.infer<typeof intervalEstimateSchema>;

export const derivedQuantitySchema = intervalEstimateSchema.extend({
  /** Coefficient (or "a~b" for a covariance or correlation; "a~a" for a variance). */
  name: z.string(),
  quantity: z.enum(['mean', 'median', 'sd', 'correlation', 'covariance', 'wrong_sign_share']),
  label: z.string(),
});
export type DerivedQuantity = z.infer<typeof derivedQuantitySchema>;

export const fitDetailSchema = z.object({
  loglikConstants: z.number().nullable(),
  rho2Constants: z.number().nullable(),
  caic: z.number(),
  /** n in BIC and CAIC, and what it counts. */
  bicN: z.number().int(),
  bicBasis: z.string(),
});

export const simulationErrorSchema = z.object({
  seeds: z.array(z.number().int()),
  parameters: z.array(
    z.object({
      name: z.string(),
      spread: z.number(),
      se: z.number().nullable(),
      ratio: z.number().nullable(),
    }),
  ),
});
