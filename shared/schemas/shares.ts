/**
 * The Shares section (what-if share simulator): 2–5 hypothetical alternatives defined by their
 * levels, optionally the study's opt-out / status quo, simulated over respondents' individual
 * taste profiles of a finished run (shared/engine/shares), overall and per segment.
 */
import { z } from 'zod';
import { studyParamsSchema } from './study-params';
import { elementIdSchema, type StudyDefinition } from './study-definition';
import { groupByFields, refineGroupBy } from './tastes';
import { addIssue } from './add-issue';
import { QUESTION_KEY_PATTERN } from './question-keys';

export const scenarioAlternativeSchema = z.object({
  name: z.string().trim().min(1, 'Name the alternative').max(60),
  /** Labeled studies: which labeled alternative this is (0-based); its constant applies. */
  alternative: z.number().int().min(0).max(4).default(0),
  /** attribute id -> level id; every attribute needs a level. */
  levels: z.record(z.string(), elementIdSchema),
});
export type ScenarioAlternative = z.infer<typeof scenarioAlternativeSchema>;

/** The alternatives of a scenario, simulated or saved: 2 to 5. */
const scenarioAlternativesSchema = z
  .array(scenarioAlternativeSchema)
  .min(2, 'Define at least 2 alternatives')
  .max(5, 'At most 5 alternatives');

const simulateSharesObject = z.object({
  runId: z.uuid('Choose a finished run'),
  alternatives: scenarioAlternativesSchema,
  /** Add the study's opt-out / status quo to the scenario. */
  includeFixed: z.boolean().default(true),
  /**
   * Shares per segment as well: by the answer to a single-choice question, a task's choice,
   * or (latent class runs) the respondent's likeliest class.
   */
  segmentBy: z
    .object({
      groupBy: z.enum(['task', 'question', 'class']),
      task: z.number().int().min(1).optional(),
      question: z.string().regex(QUESTION_KEY_PATTERN).optional(),
    })
    .nullable()
    .default(null),
});

function refineSegment(
  v: { segmentBy: { groupBy: string; task?: number; question?: string } | null },
  ctx: z.RefinementCtx,
) {
  const s = v.segmentBy;
  if (s?.groupBy === 'task' && s.task === undefined)
    addIssue(ctx, ['segmentBy', 'task'], 'Choose a task');
  if (s?.groupBy === 'question' && s.question === undefined)
    addIssue(ctx, ['segmentBy', 'question'], 'Choose a question');
}

export const simulateSharesSchema = simulateSharesObject.superRefine(refineSegment);

/** A demand curve: one alternative's share as one attribute moves across its range. */
export const sweepSchema = z.object({
  /** Which of the scenario's alternatives moves (0-based). */
  alternative: z.number().int().min(0).max(4),
  attributeId: elementIdSchema,
  /** Points of a linear sweep (a categorical attribute is swept over its levels). */
  points: z.number().int().min(2).max(41).default(11),
});
export type SweepInput = z.input<typeof sweepSchema>;

/** A scenario (and optionally its demand curve) as a file (POST …/shares/export). */
export const shareExportSchema = simulateSharesObject
  .extend({
    /** The scenario's name for the file (a saved scenario's name, or none). */
    name: z.string().trim().max(80).default(''),
    sweep: sweepSchema.nullable().default(null),
    format: z.enum(['csv', 'xlsx']),
  })
  .superRefine(refineSegment);
export type ShareExportInput = z.input<typeof shareExportSchema>;
export type ShareExport = z.output<typeof shareExportSchema>;

export type SimulateSharesInput = z.input<typeof simulateSharesSchema>;
export type SimulateShares = z.output<typeof simulateSharesSchema>;

/** How the shares were computed, shown beside the result. */
export type ShareMethod =
  /** Mixed logit: each respondent's conditional means (Revelt & Train 2000). */
  | 'conditional_means'
  /** MNL: one set of coefficients for everybody (no taste variation). */
  | 'point_estimates'
  /** HB: each respondent's posterior means (not averaged over the posterior draws). */
  | 'posterior_means'
  /** Latent class: each respondent's class probabilities times the class logit probabilities. */
  | 'class_weighted';

/**
 * Compensating variation of the scenario against a choice set holding only the status quo
 * (log-sum formula; docs/methods.md "Welfare: compensating variation"), in the cost
 * attribute's money per respondent.
 */
export type ShareWelfare = {
  /** The status quo (the study's extra alternative) the scenario is compared with. */
  baseline: string;
  /** Name and unit of the cost attribute, e.g. "Monthly bill increase", "€". */
  money: string;
  unit: string;
  /** MNL: the formula at the estimates; mixed logit: the average of respondents' values. */
  mean: number;
  /** 95 % interval: Krinsky–Robb draws from the covariance (MNL), or resampling respondents. */
  lower: number | null;
  upper: number | null;
  interval: 'krinsky_robb' | 'respondent_resampling' | null;
  respondents: number;
  /** Respondents left out because their cost coefficient is not negative. */
  withheld: number;
  /**
   * Mixed logit only: the population mean of the same formula over the model's taste
   * distribution, with a Krinsky–Robb interval from the estimates' covariance
   * (server/engine/estimation/population-welfare.ts); null with populationNote otherwise.
   */
  population: { mean: number; lower: number | null; upper: number | null } | null;
  populationNote: string | null;
};

export type ShareResult = {
  runId: string;
  method: ShareMethod;
  respondents: number;
  alternatives: { name: string; share: number }[];
  segments: {
    label: string;
    groups: { key: string; label: string; count: number; shares: number[] }[];
  } | null;
  welfare: ShareWelfare | null;
  /** Why no welfare figure is given (no status quo, no cost attribute, WTP space, …). */
  welfareNote: string | null;
};

/** Which kind of interval the shares carry (shared/engine/shares/share-draws.ts). */
export type ShareIntervalKind =
  /** Krinsky–Robb draws of the estimates from their covariance (one set of coefficients). */
  | 'parameter'
  /** Draws from each respondent's conditional distribution (individual-level runs). */
  | 'conditional';

/**
 * Everything the browser needs to recompute shares of any scenario of one run without asking
 * the server again (GET …/shares/model?runId=): the frozen definition to code scenarios, each
 * respondent's coefficients, and what the interval draws are made from.
 */
export type ShareModel = {
  runId: string;
  model: string;
  method: ShareMethod;
  definition: StudyDefinition;
  /** Run coefficients in order: name, data column key, lognormal (of either sign). */
  coefficients: { name: string; key: string; lognormal: boolean }[];
  /** N (1 for point estimates) and D vectors per respondent (latent classes, else 1). */
  respondents: number;
  vectors: number;
  /** N·D·K coefficient values and, for latent class, N·D posterior class probabilities. */
  betas: number[];
  weights: number[] | null;
  /** Conditional SDs N·K (mixed logit, HB) for conditional draws. */
  sds: number[] | null;
  /** Lower Cholesky factor K·K of the estimates' covariance, for parameter draws. */
  choleskyLower: number[] | null;
  interval: ShareIntervalKind | null;
  /** Why the shares carry no interval, when they do not. */
  intervalNote: string | null;
  /** Seed of the interval draws (the run's seed), so every recompute gives the same interval. */
  seed: number;
  /** Respondents in the estimation sample (for MNL, N = 1 but the sample is this size). */
  sampleRespondents: number;
};

export const shareModelQuerySchema = z.object({ runId: z.uuid('Choose a finished run') });

/** Segments of the share model's respondents (GET …/shares/groups). */
export const shareGroupsQuerySchema = z
  .object({ runId: z.uuid('Choose a finished run'), ...groupByFields })
  .superRefine(refineGroupBy);
export type ShareGroupsQuery = z.output<typeof shareGroupsQuerySchema>;

/** Respondents of the share model by segment: `of[n]` indexes `groups` (−1: in none). */
export type ShareGroups = {
  label: string;
  groups: { key: string; label: string }[];
  of: number[];
};

/** A saved, named scenario of a study (POST/PUT …/shares/scenarios). */
export const scenarioBodySchema = z.object({
  name: z.string().trim().min(1, 'Name the scenario').max(80, 'At most 80 characters'),
  alternatives: scenarioAlternativesSchema,
  includeFixed: z.boolean().default(true),
});
export type ScenarioBodyInput = z.input<typeof scenarioBodySchema>;
export type ScenarioBody = z.output<typeof scenarioBodySchema>;

export const scenarioParamsSchema = studyParamsSchema.extend({
  scenarioId: z.uuid('Unknown scenario'),
});

export type SavedScenario = ScenarioBody & {
  id: string;
  createdAt: string;
  updatedAt: string;
  /** Who saved it first (null when that account is gone). */
  createdBy: string | null;
};
