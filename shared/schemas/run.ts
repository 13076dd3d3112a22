/**
 * Runs (estimation jobs) as the API shows them: the input that starts one, its progress while
 * it runs, and the stored result. The model specification itself is the shared estimation spec
 * (estimation-spec.ts): in a study, each coefficient's `column` is a coded-column key such as
 * `attr:<attributeId>:<levelId>`, `attr:<attributeId>` or `asc:fixed`.
 */
import { z } from 'zod';
import { studyParamsSchema } from './study-params';
import { estimationResultSchema, estimationSpecSchema } from './estimation-spec';
import type { ModelFamily } from './estimation-families';

export const runStatusSchema = z.enum(['queued', 'running', 'done', 'failed', 'cancelled']);
export type RunStatus = z.infer<typeof runStatusSchema>;

/** Which respondents a run uses: every included, completed one, or a saved filter's subset. */
export const respondentSelectionSchema = z.object({
  filterId: z.uuid('Choose a saved filter').nullable().default(null),
});

/**
 * A saved respondent filter (respondent_filters.definition): respondent ids, background
 * question conditions, or both (all must hold). A condition holds when the answer to the
 * background question with key `question` is, or contains, one of `values` (option ids or
 * numbers).
 */
export const respondentFilterDefinitionSchema = z
  .object({
    respondentIds: z.array(z.string().min(1).max(64)).max(100_000).optional(),
    conditions: z
      .array(
        z.object({
          question: z.string().min(1, 'Choose a question').max(40),
          values: z
            .array(z.union([z.string().max(200), z.number(), z.boolean()]))
            .min(1, 'Choose at least one answer')
            .max(50),
        }),
      )
      .max(20)
      .optional(),
  })
  .refine((d) => (d.respondentIds?.length ?? 0) > 0 || (d.conditions?.length ?? 0) > 0, {
    message: 'A filter needs respondents or at least one condition',
  });
export type RespondentFilterDefinition = z.infer<typeof respondentFilterDefinitionSchema>;

/**
 * The order a run reads its respondents in, stored with the run (docs/methods.md "Run data
 * order"): the draws of a mixed logit, the sampler's sweeps and the latent class starts are
 * assigned by respondent position, so the order is part of how a run was computed. Runs stored
 * without one read respondents by id (a random UUID order); new runs read them by respondent
 * number (order of starting), which does not depend on the ids.
 */
export const runDataOrderSchema = z.enum(['respondent-id', 'respondent-number']);
export type RunDataOrder = z.infer<typeof runDataOrderSchema>;
export const RUN_DATA_ORDER: RunDataOrder = 'respondent-number';

export const createRespondentFilterSchema = z.object({
  name: z.string().trim().min(1, 'Give the filter a name').max(120),
  definition: respondentFilterDefinitionSchema,
});
export type CreateRespondentFilterInput = z.input<typeof createRespondentFilterSchema>;

export const createRunSchema = z.object({
  name: z.string().trim().max(120, 'Keep the name under 120 characters').default(''),
  spec: estimationSpecSchema,
  respondents: respondentSelectionSchema.prefault({}),
});
export type CreateRunInput = z.input<typeof createRunSchema>;
export type CreateRun = z.output<typeof createRunSchema>;

export const runParamsSchema = studyParamsSchema.extend({
  runId: z.uuid('Unknown run'),
});

/** The stages a run goes through, in order; progress names the current one. */
export const runStageSchema = z.enum([
  'preparing',
  'estimating',
  'standard_errors',
  'wtp',
  'profiles',
  'saving',
]);
export type RunStage = z.infer<typeof runStageSchema>;

/** Written by the worker every iteration; `heartbeatAt` also every few seconds. */
export const runProgressSchema = z.object({
  stage: runStageSchema.optional(),
  iteration: z.number().int().optional(),
  loglik: z.number().optional(),
  gradientNorm: z.number().optional(),
  /** Gradient norm at the first iteration: the bar shows progress toward convergence. */
  initialGradientNorm: z.number().optional(),
  elapsedMs: z.number().optional(),
  /** Estimated seconds until results are ready, from iterations and evaluation time. */
  secondsLeft: z.number().nonnegative().optional(),
  /** Upper bound of iterations, so the bar can show a share. */
  maxIterations: z.number().int().optional(),
  start: z.number().int().optional(),
  heartbeatAt: z.string().optional(),
  /**
   * Set when a worker took the run up again after the one running it was lost: the claim
   * (2 = first resume) and the iteration it went on from (0: from the beginning).
   */
  resumed: z
    .object({ attempt: z.number().int(), fromIteration: z.number().int().nonnegative() })
    .optional(),
});
export type RunProgress = z.infer<typeof runProgressSchema>;

/** One coded column the run used: key, the coefficient name and a readable label. */
export const runColumnSchema = z.object({
  key: z.string(),
  coefficient: z.string(),
  label: z.string(),
  /** Unit and basis of this column's WTP ("€ of monthly bill increase per +1 in …"); set when read. */
  wtpUnit: z.string().nullable().optional(),
});

export const runDataSummarySchema = z.object({
  respondents: z.number().int(),
  tasks: z.number().int(),
  holdoutTasks: z.number().int(),
  warmupTasksLeftOut: z.number().int(),
  /** Included, completed respondents without a usable task (left out). */
  respondentsWithoutTasks: z.number().int(),
  versions: z.array(z.number().int()),
  /** Respondents estimated per study version (versions pool: tasks are stored per respondent). */
  respondentsPerVersion: z
    .array(z.object({ version: z.number().int(), respondents: z.number().int() }))
    .optional(),
});
export type RunDataSummary = z.infer<typeof runDataSummarySchema>;

/** What a finished run stores: the engine's result without the individuals (they go to
 * taste_profiles, one row per respondent), plus the columns and the data it used. */
export const runResultSchema = estimationResultSchema.extend({
  individuals: z.null(),
  columns: z.array(runColumnSchema),
  data: runDataSummarySchema,
  /** The cost attribute's unit ("€"), so WTP is shown as money; set when read. */
  costUnit: z.string().nullable().optional(),
});
export type RunResult = z.infer<typeof runResultSchema>;

export type Run = {
  id: string;
  studyId: string;
  name: string;
  model: ModelFamily;
  status: RunStatus;
  spec: z.output<typeof estimationSpecSchema>;
  respondents: { filterId: string | null };
  /** How the run read its respondents; older runs say 'respondent-id'. */
  dataOrder: RunDataOrder;
  dataHash: string | null;
  seed: number | null;
  progress: RunProgress;
  results: RunResult | null;
  error: string | null;
  attempts: number;
  cancelRequested: boolean;
  /**
   * Respondents whose data this run may have used and who were erased on request since: its
   * results still reflect them until the model is estimated again.
   */
  erasedRespondents: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
};

/** A coded column a run can use, with the name the form proposes for its coefficient. */
export type ModelColumn = {
  key: string;
  code: string;
  label: string;
  kind: 'level' | 'linear' | 'constant';
  attributeId: string | null;
  isCost: boolean;
};

/** A background question a latent class run can use for class membership. */
export type MembershipQuestionOption = {
  key: string;
  text: string;
  type: 'single' | 'number';
  /** Answer options of a single-choice question (0 for a number). */
  optionCount: number;
};

/** What the Models form needs: the coded columns, how many respondents, saved filters. */
export type RunOptions = {
  columns: ModelColumn[];
  includedRespondents: number;
  filters: { id: string; name: string }[];
  hasRuns: boolean;
  /** Single-choice (up to MEMBERSHIP_MAX_OPTIONS options) and number questions. */
  membershipQuestions: MembershipQuestionOption[];
};

/** Conditional means of every respondent in a run, per coefficient (no respondent ids). */
export type ConditionalMeans = {
  coefficients: string[];
  /** values[k][i]: conditional mean of coefficient k for respondent i. */
  values: number[][];
  effectiveDraws: number[];
};
