/**
 * The specification and result parts of the two individual-level families beyond the panel mixed
 * logit: hierarchical Bayes (model "hb": sampler settings `mcmc`, `priors`) and the latent class
 * logit (model "latent_class": `classes`, `membership`; `starts` is shared with the mixed logit).
 * Kept apart from estimation-spec.ts so each family's rules read in one place.
 */
import { z } from 'zod';
import { addIssue } from './add-issue';

/** Hierarchical Bayes distributions; the order is the sampler's code of each (append only). */
export const HB_DISTRIBUTIONS = ['normal', 'lognormal', 'neg_lognormal', 'fixed'] as const;
export const LATENT_CLASS_MAX = 8;
/** Starts of a latent class model when the spec gives none. */
export const LATENT_CLASS_DEFAULT_STARTS = 10;

const seedSchema = z
  .number()
  .int()
  .min(0)
  .max(2 ** 31 - 1);

/**
 * The HB sampler's defaults (burn-in: half the iterations). One random-walk MH step per respondent
 * per iteration left μ's ESS at 44-1,707 on the demo study; 5 steps and 40,000 iterations kept
 * every 20th draw gave 443-1,893 with R-hat ≤ 1.008 (docs/methods.md, "Hierarchical Bayes: mixing
 * of μ"): steps beyond 5 did not help there, run length did.
 */
export const HB_DEFAULTS = { iterations: 40_000, thin: 20, steps: 5, chains: 2 } as const;

/**
 * Sampler settings: iterations per chain (burn-in included), burn-in, thinning, MH steps per
 * respondent per iteration, chains, seed.
 */
export const mcmcSchema = z
  .object({
    iterations: z
      .number()
      .int()
      .min(100, 'Use at least 100 iterations')
      .max(2_000_000)
      .default(HB_DEFAULTS.iterations),
    /** Default: half the iterations. */
    burnin: z.number().int().min(0).optional(),
    thin: z.number().int().min(1).max(10_000).default(HB_DEFAULTS.thin),
    steps: z
      .number()
      .int()
      .min(1, 'Use at least 1 step')
      .max(50, 'Use at most 50 steps')
      .default(HB_DEFAULTS.steps),
    chains: z.number().int().min(1).max(16).default(HB_DEFAULTS.chains),
    seed: seedSchema.default(1),
  })
  .superRefine((m, ctx) => {
    const burnin = m.burnin ?? Math.floor(m.iterations / 2);
    if (burnin >= m.iterations)
      addIssue(ctx, ['burnin'], 'Burn-in must be shorter than the iterations');
    else if (Math.floor((m.iterations - burnin) / m.thin) < 20)
      addIssue(
        ctx,
        ['thin'],
        'Keep at least 20 draws per chain: (iterations − burn-in) / thinning ≥ 20',
      );
  });
export type McmcSpec = z.output<typeof mcmcSchema>;

/**
 * Priors μ ~ N(muMean, muVariance·I), Σ ~ IW(ν, scale·I). Preset "rossi": ν = K + 3, scale = ν;
 * "train": ν = K, scale = K (K = random coefficients). nu/scale override the preset.
 */
export const hbPriorsSchema = z.object({
  preset: z.enum(['rossi', 'train']).default('rossi'),
  muMean: z.number().default(0),
  muVariance: z.number().positive('Use a positive variance').default(100),
  nu: z.number().positive().optional(),
  scale: z.number().positive().optional(),
});
export type HbPriorsSpec = z.output<typeof hbPriorsSchema>;

export const classesSchema = z.union([
  z.number().int().min(1).max(LATENT_CLASS_MAX),
  z
    .tuple([
      z.number().int().min(1).max(LATENT_CLASS_MAX),
      z.number().int().min(1).max(LATENT_CLASS_MAX),
    ])
    .refine(([lo, hi]) => lo <= hi, 'Give the range as [fewest, most] classes'),
]);

/**
 * Class membership from background answers (study runs): single-choice questions with at most
 * this many answer options (one dummy per option but the first), numeric questions as they are.
 */
export const MEMBERSHIP_MAX_OPTIONS = 10;

/** The family fields of the estimation spec (all optional; defaults apply per model). */
export const familySpecFields = {
  mcmc: mcmcSchema.optional(),
  priors: hbPriorsSchema.optional(),
  classes: classesSchema.optional(),
  /** Background variables of the class-membership model (data columns, or question keys in a study). */
  membership: z.array(z.string().trim().min(1).max(200)).max(20).optional(),
};

type FamilySpec = {
  model: string;
  space?: string;
  coefficients: { distribution: string }[];
  correlated: boolean;
  membership?: string[];
  priors?: { nu?: number };
};

/** Rules of the HB and latent class families, for the spec's superRefine. */
export function refineFamilySpec(spec: FamilySpec, ctx: z.RefinementCtx): void {
  if ((spec.model === 'hb' || spec.model === 'latent_class') && spec.space === 'wtp')
    addIssue(
      ctx,
      ['space'],
      'WTP space is available for the MNL and the mixed logit; HB and latent class give WTP per respondent',
    );
  if (spec.model === 'hb') {
    spec.coefficients.forEach((c, i) => {
      if (!(HB_DISTRIBUTIONS as readonly string[]).includes(c.distribution))
        addIssue(
          ctx,
          ['coefficients', i, 'distribution'],
          'Hierarchical Bayes coefficients are normal, lognormal (either sign) or fixed',
        );
    });
    const random = spec.coefficients.filter((c) => c.distribution !== 'fixed').length;
    if (random === 0)
      addIssue(ctx, ['coefficients'], 'Hierarchical Bayes needs at least one random coefficient');
    if (spec.correlated && random < 2)
      addIssue(ctx, ['correlated'], 'Correlation needs at least two random coefficients');
    if (spec.priors?.nu !== undefined && !(spec.priors.nu > random - 1))
      addIssue(ctx, ['priors', 'nu'], `ν must exceed ${random - 1} (random coefficients − 1)`);
  }
  if (spec.model === 'latent_class') {
    spec.coefficients.forEach((c, i) => {
      if (c.distribution !== 'fixed')
        addIssue(
          ctx,
          ['coefficients', i, 'distribution'],
          'Latent class coefficients are fixed within each class',
        );
    });
    if (spec.correlated) addIssue(ctx, ['correlated'], 'Correlation needs model "mixed" or "hb"');
    const names = spec.membership ?? [];
    names.forEach((name, i) => {
      if (names.indexOf(name) !== i) addIssue(ctx, ['membership', i], `${name} is listed twice`);
    });
  }
}

const summarySchema = z.object({
  mean: z.number(),
  sd: z.number(),
  lower: z.number(),
  upper: z.number(),
});

/** Convergence diagnostics of an HB run. */
export const hbDiagnosticsSchema = z.object({
  parameters: z.array(
    z.object({ name: z.string(), rhat: z.number().nullable(), ess: z.number().nullable() }),
  ),
  rhatMax: z.number().nullable(),
  essMin: z.number().nullable(),
  flagged: z.boolean(),
  rhatLimit: z.number(),
  chains: z.array(
    z.object({
      chain: z.number().int(),
      acceptanceBurnin: z.number().nullable(),
      acceptance: z.number(),
      acceptanceFixed: z.number().nullable(),
      scale: z.number(),
      trace: z.object({
        iteration: z.array(z.number()),
        acceptance: z.array(z.number()),
        mean: z.record(z.string(), z.array(z.number())),
        variance: z.record(z.string(), z.array(z.number())),
      }),
    }),
  ),
});
export type HbDiagnosticsResult = z.infer<typeof hbDiagnosticsSchema>;

/** The sampler an HB run used, for reports and the methods sheet. */
export const hbSamplerSchema = z.object({
  iterations: z.number().int(),
  burnin: z.number().int(),
  thin: z.number().int(),
  /** Absent in runs made before the option existed (they took one step). */
  steps: z.number().int().optional(),
  chains: z.number().int(),
  seed: z.number().int(),
  keptPerChain: z.number().int(),
  correlated: z.boolean(),
  priors: z.object({
    preset: z.enum(['rossi', 'train', 'custom']),
    muMean: z.number(),
    muVariance: z.number(),
    nu: z.number(),
    scale: z.number(),
  }),
  correlations: z.array(z.object({ a: z.string(), b: z.string() }).extend(summarySchema.shape)),
});

const estimateWithSe = z.object({
  name: z.string(),
  estimate: z.number(),
  se: z.number().nullable(),
});

export const latentClassSchema = z.object({
  class: z.number().int(),
  share: z.number(),
  shareSe: z.number().nullable(),
  estimates: z.array(estimateWithSe),
  wtp: z.array(estimateWithSe).nullable(),
  membership: z.array(estimateWithSe),
});

export const classSelectionRowSchema = z.object({
  classes: z.number().int(),
  loglik: z.number().nullable(),
  parameters: z.number().int(),
  aic: z.number().nullable(),
  bic: z.number().nullable(),
  caic: z.number().nullable(),
  bestStarts: z.number().int(),
  starts: z.number().int(),
  reason: z.string().nullable(),
});

/** Result fields only some families fill (absent for the others). */
export const familyResultFields = {
  /** HB: Newton-Raphson harmonic-mean estimate of the log marginal density. */
  logMarginalDensity: z.number().nullable().optional(),
  /** HB and latent class: hit rates with each respondent's own estimates. */
  individualHitRate: z.number().nullable().optional(),
  individualHoldoutHitRate: z.number().nullable().optional(),
  /** Latent class: consistent AIC. */
  caic: z.number().optional(),
  diagnostics: hbDiagnosticsSchema.optional(),
  sampler: hbSamplerSchema.optional(),
  classes: z.array(latentClassSchema).optional(),
  classSelection: z.array(classSelectionRowSchema).optional(),
  membership: z.array(z.string()).optional(),
};

/** Per-respondent fields only some families fill. */
export const familyProfileFields = {
  /** HB: 95 % posterior interval of each coefficient and WTP, and the WTP's posterior SD. */
  lower: z.record(z.string(), z.number()).optional(),
  upper: z.record(z.string(), z.number()).optional(),
  wtpSd: z.record(z.string(), z.number()).optional(),
  wtpLower: z.record(z.string(), z.number()).optional(),
  wtpUpper: z.record(z.string(), z.number()).optional(),
  /** Latent class: posterior class probabilities (class 1 first) and the likeliest class. */
  classProbabilities: z.array(z.number()).optional(),
  likeliestClass: z.number().int().optional(),
};

/** Display names of the model families, used by the app, reports and exports. */
export const MODEL_LABELS = {
  mnl: 'Multinomial logit (MNL)',
  mixed: 'Panel mixed logit',
  hb: 'Hierarchical Bayes logit',
  latent_class: 'Latent class logit',
} as const;
export type ModelFamily = keyof typeof MODEL_LABELS;
