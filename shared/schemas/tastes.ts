/**
 * The Tastes section's contract: the per-respondent profile table (server-side paging, sorting,
 * filtering), segments of one coefficient's conditional means, and one respondent's page.
 * Personal columns (external id, free-text answers) appear only for roles with
 * 'personal:read'; the server leaves them out otherwise.
 */
import { z } from 'zod';
import { studyParamsSchema } from './study-params';
import type { StudyDefinition } from './study-definition';
import type { ModelFamily } from './estimation-families';
import { addIssue } from './add-issue';
import { QUESTION_KEY_PATTERN } from './question-keys';

/**
 * A profile whose effective number of draws (Kish, 1/Σw²) is below this is flagged: its
 * conditional mean rests on few draws and is noisy. 30 is a rule of thumb for a stable mean
 * (common practice, no source); raise the profile draws when many respondents fall below it.
 */
export const LOW_EFFECTIVE_DRAWS = 30;

const questionKeyParam = z.string().regex(QUESTION_KEY_PATTERN, 'Unknown question');
const coefficientName = z.string().regex(/^[A-Za-z_][A-Za-z0-9_.-]{0,99}$/, 'Unknown coefficient');
const boolString = z.enum(['true', 'false']).transform((v) => v === 'true');

export const tasteSortSchema = z
  .string()
  .regex(
    /^(number|effectiveDraws|(mean|sd|wtp):[A-Za-z_][A-Za-z0-9_.-]{0,99})$/,
    'Sort by number, effectiveDraws, or mean:, sd:, wtp: and a coefficient',
  );

export const listTastesQuerySchema = z.object({
  runId: z.uuid('Choose a finished run'),
  page: z.coerce.number().int().min(1, 'Pages start at 1').max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'At most 200 rows a page').default(25),
  sort: tasteSortSchema.default('number'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  /** Only profiles with few effective draws (true) or only the others (false). */
  lowDraws: boolString.optional(),
  /** Only respondents with at least one quality flag (true) or none (false). */
  flagged: boolString.optional(),
  /** Background question key and the option id (or number) to keep. */
  question: questionKeyParam.optional(),
  answer: z.string().min(1).max(40).optional(),
});
export type ListTastesQuery = z.output<typeof listTastesQuerySchema>;

/** Two runs whose individual estimates are compared, respondent by respondent. */
export const compareTastesQuerySchema = z
  .object({
    runId: z.uuid('Choose a finished run'),
    otherRunId: z.uuid('Choose a second finished run'),
  })
  .refine((q) => q.runId !== q.otherRunId, {
    path: ['otherRunId'],
    message: 'Choose a different run to compare with',
  });

/** Per coefficient both runs share: the respondents' pairs of individual means and their correlation. */
export type TasteComparison = {
  run: TastesRun;
  other: TastesRun;
  /** Respondents with a profile in both runs. */
  respondents: number;
  coefficients: {
    name: string;
    label: string;
    correlation: number | null;
    /** Mean over respondents of (other − run). */
    meanDifference: number;
    /** [value in run, value in other run] per respondent (no ids). */
    pairs: [number, number][];
  }[];
};

export const tastesRunQuerySchema = z.object({ runId: z.uuid('Choose a finished run') });

/**
 * How respondents are split into groups (Tastes segments, Shares segments): by the alternative
 * chosen in a task, the answer to a background question, or (latent class runs only) the
 * likeliest class.
 */
export const groupByFields = {
  groupBy: z.enum(['task', 'question', 'class']),
  task: z.coerce.number().int().min(1).max(2000).optional(),
  question: questionKeyParam.optional(),
};

/** A task or question grouping names its task or question. */
export function refineGroupBy(
  q: { groupBy: 'task' | 'question' | 'class'; task?: number; question?: string },
  ctx: z.RefinementCtx,
): void {
  if (q.groupBy === 'task' && q.task === undefined) addIssue(ctx, ['task'], 'Choose a task');
  if (q.groupBy === 'question' && q.question === undefined)
    addIssue(ctx, ['question'], 'Choose a question');
}

export const segmentsQuerySchema = z
  .object({
    runId: z.uuid('Choose a finished run'),
    coefficient: coefficientName,
    ...groupByFields,
    bins: z.coerce.number().int().min(3).max(60).optional(),
  })
  .superRefine(refineGroupBy);
export type SegmentsQuery = z.output<typeof segmentsQuerySchema>;

export const respondentProfileParamsSchema = studyParamsSchema.extend({
  runId: z.uuid('Unknown run'),
  respondentId: z.uuid('Unknown respondent'),
});

/** A finished run that has taste profiles. */
export type TastesRun = {
  id: string;
  name: string;
  model: ModelFamily;
  finishedAt: string | null;
  profiles: number;
  profileDraws: number | null;
  /** Respondents erased on request since the run (their profiles are gone, not their influence). */
  erasedRespondents: number;
  /** Why the run gives no WTP (no cost coefficient, or WTP withheld), or null when it does. */
  wtpUnavailable: string | null;
};

export type TasteCoefficient = {
  name: string;
  label: string;
  distribution: string;
  populationMean: number;
  populationSd: number;
  /** Estimated location and spread (for lognormals: of ln |β|), to draw the density. */
  location: number;
  spread: number;
};

export type TasteQuestion = {
  key: string;
  text: string;
  type: 'single' | 'multiple' | 'number' | 'text';
  options: { id: string; label: string }[];
  /** Free text may identify a person: shown only with 'personal:read'. */
  personal: boolean;
  /** Its page is shown only when a skip rule applies (exports then flag skipped answers). */
  conditional?: boolean;
};

export type TasteRow = {
  respondentId: string;
  /** Stable number of the respondent in the study (order of starting). */
  number: number;
  /** Present only for roles with 'personal:read'. */
  externalId?: string | null;
  block: number;
  flags: string[];
  mean: Record<string, number>;
  sd: Record<string, number>;
  wtp: Record<string, number> | null;
  effectiveDraws: number;
  lowDraws: boolean;
  /** HB: 95 % posterior interval of each coefficient. */
  lower?: Record<string, number>;
  upper?: Record<string, number>;
  /** Latent class: the likeliest class and its posterior probability. */
  likeliestClass?: number;
  classProbability?: number;
  /** Question key -> readable answer (option labels, number) or null. */
  answers: Record<string, string | null>;
};

export type TasteHeader = {
  run: TastesRun;
  coefficients: TasteCoefficient[];
  /** Coefficients with a WTP value (all but the cost). */
  wtp: string[];
  cost: string | null;
  costUnit: string;
  questions: TasteQuestion[];
  tasks: { task: number; block: number }[];
  personalColumns: boolean;
  lowDrawsThreshold: number;
};

export type TasteList = TasteHeader & {
  page: number;
  pageSize: number;
  total: number;
  rows: TasteRow[];
};

export type SegmentGroup = {
  key: string;
  label: string;
  count: number;
  mean: number;
  /** Sample SD (n − 1 denominator); null with fewer than 2 values. */
  sd: number | null;
  min: number;
  q1: number;
  median: number;
  q3: number;
  max: number;
  /** Counts per bin of the edges every group shares. */
  histogram: number[];
};

export type Segments = {
  coefficient: TasteCoefficient;
  groupLabel: string;
  edges: number[];
  groups: SegmentGroup[];
  /** Respondents with a profile but no answer in the grouping. */
  ungrouped: number;
};

export type RespondentChoice = {
  task: number;
  /** Screen order in which the respondent saw it (1-based), or null. */
  position: number | null;
  alternatives: {
    index: number;
    label: string;
    /** attribute name -> level label (readable). */
    levels: Record<string, string>;
    /** attribute id -> level id (for the task card). */
    levelIds: Record<string, string>;
    fixed: boolean;
  }[];
  chosen: number | null;
  responseMs: number | null;
};

export type RespondentProfile = {
  header: TasteHeader;
  /** The definition of the study version the respondent answered. */
  definition: StudyDefinition;
  row: TasteRow;
  choices: RespondentChoice[];
};
