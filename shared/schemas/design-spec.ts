/**
 * What the researcher asks the design generator for: the method, the number of tasks and
 * blocks, the priors on the coded columns (keys from getCodedColumns), and search settings.
 */
import { z } from 'zod';
import { addIssue } from './add-issue';

export const designMethodSchema = z.enum(['full_factorial', 'random', 'd_efficient']);
export type DesignMethod = z.infer<typeof designMethodSchema>;

/** Key of a coded column, e.g. `attr:bill`, `attr:river:good`, `asc:fixed`. */
const columnKeySchema = z.string().trim().min(1).max(200);

export const fixedPriorColumnSchema = z.object({
  key: columnKeySchema,
  mean: z.number().finite(),
});

export const bayesianPriorColumnSchema = z.object({
  key: columnKeySchema,
  mean: z.number().finite(),
  sd: z.number().finite().min(0, 'A prior SD cannot be negative'),
});

export const designPriorsSchema = z.discriminatedUnion('kind', [
  /** β = 0: the D₀ criterion, no dominance can be known. */
  z.object({ kind: z.literal('zero') }),
  /** Point priors: one mean per coded column. */
  z.object({ kind: z.literal('fixed'), columns: z.array(fixedPriorColumnSchema).max(300) }),
  /** Independent normal priors averaged over quasi-random draws (Bayesian D-error). */
  z.object({
    kind: z.literal('bayesian'),
    columns: z.array(bayesianPriorColumnSchema).max(300),
    draws: z.number().int().min(10, 'Use at least 10 prior draws').max(5000).default(200),
  }),
]);
export type DesignPriors = z.infer<typeof designPriorsSchema>;

/**
 * Dominance screening under the priors' signs (server/engine/design/dominance-tables.ts for
 * the definition); each rule can be switched off and is reported in the diagnostics.
 */
export const dominanceRulesSchema = z.object({
  /** No designed alternative dominates another one of its task. */
  betweenDesigned: z.boolean().default(true),
  /** No designed alternative dominates the opt-out / status quo. */
  overFixed: z.boolean().default(true),
  /** The opt-out / status quo dominates no designed alternative. */
  byFixed: z.boolean().default(true),
});
export type DominanceRules = z.infer<typeof dominanceRulesSchema>;

/** How often levels appear, and how much alternatives of a task may share. */
export const balanceRulesSchema = z.object({
  /** Every level a designed alternative may show appears at least this often in the design. */
  minAppearances: z.number().int().min(0).max(1000).default(1),
  /** Each level of an attribute appears ⌊n/L⌋ or ⌈n/L⌉ times over the designed alternatives. */
  levelBalance: z.boolean().default(false),
  /** At most this many attributes show one level in all designed alternatives of a task. */
  maxOverlap: z.number().int().min(0).max(20).nullable().default(null),
});
export type BalanceRules = z.infer<typeof balanceRulesSchema>;

/**
 * What the D-efficient search minimises (all four are reported for every design):
 * D-error (Huber & Zwerina 1996), A-error = tr(AVC)/K, the S-estimate max_k t²·AVC_kk/β_k²
 * (Rose & Bliemer 2013) and the C-error Σ_k Var(−β_k/β_cost) (Scarpa & Rose 2008);
 * docs/methods.md, "Design criteria".
 */
export const designCriterionSchema = z.enum(['d_error', 'a_error', 's_estimate', 'c_error']);
export type DesignCriterion = z.infer<typeof designCriterionSchema>;

/**
 * The seeded generator the design engine uses now. Stored with every generated design
 * (spec.generatorVersion); a design stored without it was made by version 1. The same seed
 * gives the same design only within one version (docs/methods.md "Design generator versions").
 */
export const DESIGN_GENERATOR_VERSION = 2;

export const designSpecSchema = z
  .object({
    method: designMethodSchema,
    /** Tasks in the whole design; for full_factorial it is implied (one per feasible profile). */
    tasks: z.number().int().min(1).max(2000).optional(),
    blocks: z.number().int().min(1).max(50).default(1),
    priors: designPriorsSchema.default({ kind: 'zero' }),
    /** Random starts of the coordinate exchange (d_efficient only). */
    starts: z.number().int().min(1).max(100).default(5),
    seed: z.number().int().min(0).max(2147483647).default(1),
    /** Set by the server on the stored spec; a request may repeat it, never ask for another. */
    generatorVersion: z
      .literal(DESIGN_GENERATOR_VERSION, {
        error: `Designs are made with generator version ${DESIGN_GENERATOR_VERSION}; earlier versions are kept as they were made but cannot be generated again`,
      })
      .optional(),
    /** Maximum coordinate-exchange passes per start (d_efficient only). */
    maxIterations: z.number().int().min(1).max(1000).default(50),
    /** The criterion the search minimises; D-error unless chosen otherwise. */
    criterion: designCriterionSchema.default('d_error'),
    /** The run whose estimates gave the priors (pilot → priors → redesign), for the record. */
    priorsSource: z.object({ runId: z.uuid(), spread: z.enum(['se', 'population']) }).optional(),
    /** Target |t|-ratio of the S-estimate (1.96: significant at 5 %, two-sided). */
    tValue: z.number().finite().min(0.5, 'Use a t-value of at least 0.5').max(10).default(1.96),
    dominance: dominanceRulesSchema.prefault({}),
    balance: balanceRulesSchema.prefault({}),
  })
  .superRefine((spec, ctx) => {
    if (spec.method !== 'full_factorial' && spec.tasks === undefined)
      addIssue(ctx, ['tasks'], 'Give the number of tasks');
    if (spec.tasks !== undefined && spec.tasks % spec.blocks !== 0)
      addIssue(ctx, ['blocks'], 'The number of tasks must be a multiple of the number of blocks');
  });
export type DesignSpec = z.infer<typeof designSpecSchema>;
export type DesignSpecInput = z.input<typeof designSpecSchema>;
