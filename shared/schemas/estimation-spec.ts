/**
 * What an estimation run is asked to fit (the specification of a Run) and the shape of its
 * result. Shared by the CLI (scripts/estimate.ts), the job runner and the web app.
 */
import { z } from 'zod';
import {
  convergenceDetailSchema,
  covarianceResultSchema,
  derivedQuantitySchema,
  estimationSettingsSchema,
  estimationWarningSchema,
  fitDetailSchema,
  intervalEstimateSchema,
  simulationErrorSchema,
} from './estimation-inference';
import {
  familyProfileFields,
  familyResultFields,
  familySpecFields,
  refineFamilySpec,
} from './estimation-families';
import { addIssue } from './add-issue';

/**
 * The one list of coefficient distributions. Its order is the engine's numeric code of each
 * (server/engine/estimation/distribution-codes.ts): append, never reorder.
 */
export const COEFFICIENT_DISTRIBUTIONS = [
  'fixed',
  'normal',
  'lognormal',
  'neg_lognormal',
  'triangular',
  'uniform',
] as const;
export const coefficientDistributionSchema = z.enum(COEFFICIENT_DISTRIBUTIONS);
export type CoefficientDistributionInput = z.infer<typeof coefficientDistributionSchema>;

export const drawsTypeSchema = z.enum(['halton', 'sobol', 'mlhs', 'random']);
/** One name per draws type, used by the run form, the run's fit table and the exports alike. */
export const drawsTypeLabels: Record<z.infer<typeof drawsTypeSchema>, string> = {
  halton: 'scrambled Halton',
  sobol: 'Sobol',
  mlhs: 'modified Latin hypercube',
  random: 'pseudo-random',
};

const nameSchema = z
  .string()
  .trim()
  .min(1, 'A name is required')
  .max(100)
  .regex(/^[A-Za-z_][A-Za-z0-9_.-]*$/, 'Use letters, digits, _ . - and start with a letter or _');

export const coefficientSpecSchema = z.object({
  name: nameSchema,
  /** Data column of the attribute; defaults to the coefficient name. */
  column: z.string().trim().min(1).max(200).optional(),
  distribution: coefficientDistributionSchema.default('fixed'),
});

export const estimationSpecSchema = z
  .object({
    model: z.enum(['mnl', 'mixed', 'hb', 'latent_class']),
    coefficients: z.array(coefficientSpecSchema).min(1, 'List at least one coefficient').max(100),
    correlated: z.boolean().default(false),
    draws: z
      .object({
        type: drawsTypeSchema.default('halton'),
        count: z.number().int().min(10, 'Use at least 10 draws').max(100_000).default(500),
        seed: z
          .number()
          .int()
          .min(0)
          .max(2 ** 31 - 1)
          .default(1),
      })
      .prefault({}),
    /** Draws per respondent for the taste profiles (separate from estimation draws). */
    profileDraws: z.number().int().min(10).max(100_000).default(2000),
    /** Name of the cost coefficient for WTP; omit for no WTP. */
    cost: z.string().trim().min(1).optional(),
    /** Starting points: mixed logit (1 = the MNL-based start only; default 3), latent class EM (default 10). */
    starts: z.number().int().min(1).max(20).optional(),
    /** Preference space, or WTP space (Train & Weeks 2005; needs `cost`). */
    space: z.enum(['preference', 'wtp']).default('preference'),
    /** Optimiser tolerances, iteration limit, covariance choice, simulation-noise check. */
    settings: estimationSettingsSchema.prefault({}),
    ...familySpecFields,
  })
  .superRefine((spec, ctx) => {
    const names = spec.coefficients.map((c) => c.name);
    names.forEach((name, i) => {
      if (names.indexOf(name) !== i)
        addIssue(ctx, ['coefficients', i, 'name'], `Coefficient name ${name} is used twice`);
    });
    const random = spec.coefficients.filter((c) => c.distribution !== 'fixed');
    if (spec.model === 'mnl') {
      spec.coefficients.forEach((c, i) => {
        if (c.distribution !== 'fixed') {
          addIssue(
            ctx,
            ['coefficients', i, 'distribution'],
            'An MNL has fixed coefficients only; choose model "mixed" for random ones',
          );
        }
      });
      if (spec.correlated) addIssue(ctx, ['correlated'], 'Correlation needs model "mixed"');
    } else if (spec.model === 'mixed' && random.length === 0) {
      addIssue(ctx, ['coefficients'], 'A mixed logit needs at least one random coefficient');
    }
    if (
      spec.model === 'mixed' &&
      spec.correlated &&
      spec.coefficients.filter((c) => c.distribution === 'normal').length < 2
    ) {
      addIssue(ctx, ['correlated'], 'Correlation needs at least two normal coefficients');
    }
    refineFamilySpec(spec, ctx);
    if (spec.cost !== undefined && !names.includes(spec.cost)) {
      addIssue(ctx, ['cost'], `Cost ${spec.cost} is not one of the coefficients`);
    }
    if (spec.space === 'wtp') {
      const cost = spec.coefficients.find((c) => c.name === spec.cost);
      if (!cost) addIssue(ctx, ['space'], 'WTP space needs a cost coefficient');
      else if (!['fixed', 'lognormal', 'neg_lognormal'].includes(cost.distribution))
        addIssue(
          ctx,
          ['space'],
          'In WTP space the cost must be fixed or lognormal, so its sign never changes',
        );
    }
  });

export type EstimationSpecInput = z.input<typeof estimationSpecSchema>;
export type EstimationSpec = z.output<typeof estimationSpecSchema>;

export const parameterEstimateSchema = z.object({
  name: z.string(),
  estimate: z.number(),
  se: z.number().nullable(),
  robustSe: z.number().nullable(),
});

export const tasteProfileSchema = z.object({
  respondent: z.string(),
  mean: z.record(z.string(), z.number()),
  sd: z.record(z.string(), z.number()),
  wtp: z.record(z.string(), z.number()).optional(),
  /** Mixed logit: Kish's effective number of draws; HB: the smallest ESS of the respondent's
   * coefficients; latent class: the effective number of classes 1/Σ h². */
  effectiveDraws: z.number(),
  ...familyProfileFields,
});

/** Population WTP of one attribute: `estimate`… are the MEAN WTP; `median` its median. */
export const wtpEstimateSchema = z.object({
  name: z.string(),
  estimate: z.number(),
  se: z.number().nullable(),
  deltaLower: z.number().nullable(),
  deltaUpper: z.number().nullable(),
  lower: z.number().nullable(),
  upper: z.number().nullable(),
  median: intervalEstimateSchema.nullable().optional(),
});

export const populationMomentSchema = z.object({
  name: z.string(),
  /** "discrete": the latent class model's mass points (shares × class coefficients). */
  distribution: z.union([coefficientDistributionSchema, z.literal('discrete')]),
  mean: z.number(),
  sd: z.number(),
  location: z.number(),
  spread: z.number(),
});

/** The JSON a run produces (numbers that cannot be computed are null). */
export const estimationResultSchema = z.object({
  model: z.enum(['mnl', 'mixed', 'hb', 'latent_class']),
  loglik: z.number(),
  loglikNull: z.number(),
  respondents: z.number().int(),
  observations: z.number().int(),
  parameters: z.number().int(),
  iterations: z.number().int(),
  converged: z.boolean(),
  convergence: z.object({
    reason: z.string(),
    /** Null for the HB sampler, which has no gradient to drive to zero. */
    gradientNorm: z.number().nullable(),
    relativeChange: z.number().nullable(),
  }),
  rho2: z.number(),
  adjRho2: z.number(),
  aic: z.number(),
  bic: z.number(),
  hitRate: z.number(),
  holdoutHitRate: z.number().nullable(),
  estimates: z.array(parameterEstimateSchema),
  population: z.array(populationMomentSchema),
  wtp: z.array(wtpEstimateSchema).nullable(),
  individuals: z.array(tasteProfileSchema).nullable(),
  draws: z
    .object({ type: drawsTypeSchema, count: z.number().int(), seed: z.number().int() })
    .nullable(),
  profileDraws: z
    .object({ type: drawsTypeSchema, count: z.number().int(), seed: z.number().int() })
    .nullable(),
  elapsedSeconds: z.number(),
  // Added with the trust work; optional so results stored before it still parse.
  space: z.enum(['preference', 'wtp']).optional(),
  convergenceDetail: convergenceDetailSchema.optional(),
  warnings: z.array(estimationWarningSchema).optional(),
  covariance: covarianceResultSchema.nullable().optional(),
  fit: fitDetailSchema.optional(),
  derived: z.array(derivedQuantitySchema).optional(),
  /** Why WTP (population mean/median and per respondent) is not given, when it is not. */
  wtpWithheld: z.string().nullable().optional(),
  simulationError: simulationErrorSchema.nullable().optional(),
  ...familyResultFields,
});
export type EstimationResult = z.infer<typeof estimationResultSchema>;
