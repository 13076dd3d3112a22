/**
 * The questionnaire wrapped around the choice tasks: an ordered list of pages, stored as JSON in
 * studies.questionnaire and frozen into each live version. Structural rules (one consent page
 * first, one task block, one end page last, unique keys) live here; rules that need the study
 * definition or the design are checked at go-live (server/services/lifecycle.ts).
 */
import { z } from 'zod';
import { elementIdSchema } from './study-definition';
import { quotaProblems } from '../survey/quota-cells';
import { skipRuleProblems } from '../survey/skip-logic';
import { addIssue } from './add-issue';
import { QUESTION_KEY_PATTERN } from './question-keys';

const title = z.string().trim().min(1, 'Give the page a title').max(200);
const body = z.string().trim().max(6000);

/** Column-safe key: it names the question's column in exports. */
export const questionKeySchema = z
  .string()
  .regex(QUESTION_KEY_PATTERN, 'Start with a letter; use lowercase letters, digits and _');

export const choiceOptionSchema = z.object({
  id: elementIdSchema,
  label: z.string().trim().min(1, 'An option needs a label').max(200),
});
export type ChoiceOption = z.infer<typeof choiceOptionSchema>;

const questionBase = {
  key: questionKeySchema,
  text: z.string().trim().min(1, 'Write the question').max(1000),
  help: z.string().trim().max(1000).default(''),
  required: z.boolean().default(true),
};

const optionsList = z
  .array(choiceOptionSchema)
  .min(2, 'Give at least 2 options')
  .max(30)
  .refine((o) => new Set(o.map((x) => x.id)).size === o.length, 'Option ids must be unique');

export const questionSchema = z.discriminatedUnion('type', [
  z.object({ ...questionBase, type: z.literal('single'), options: optionsList }),
  z.object({ ...questionBase, type: z.literal('multiple'), options: optionsList }),
  z
    .object({
      ...questionBase,
      type: z.literal('number'),
      min: z.number().finite(),
      max: z.number().finite(),
      integer: z.boolean().default(true),
      unit: z.string().trim().max(40).default(''),
    })
    .refine((q) => q.min < q.max, {
      message: 'The minimum must be below the maximum',
      path: ['max'],
    }),
  z.object({
    ...questionBase,
    type: z.literal('text'),
    maxLength: z.number().int().min(1).max(2000).default(500),
  }),
]);
export type Question = z.infer<typeof questionSchema>;
export type QuestionType = Question['type'];

/**
 * A hand-set task: one the researcher composes in the questionnaire (warm-up, holdout), with one
 * level id per attribute per alternative, instead of taking it from the design.
 */
export const handSetTaskAlternativeSchema = z.object({
  levels: z.record(z.string(), elementIdSchema),
});

const page = { id: elementIdSchema };

/**
 * Skip logic: the page is shown only when the answer to an earlier question matches (one of
 * the options, or a number within min..max); otherwise the respondent goes past it and the
 * answer is stored as skipped (shared/survey/skip-logic.ts).
 */
export const showIfSchema = z.object({
  questionKey: questionKeySchema,
  optionIds: z.array(elementIdSchema).max(30).default([]),
  min: z.number().finite().nullable().default(null),
  max: z.number().finite().nullable().default(null),
});
export type ShowIf = z.infer<typeof showIfSchema>;
const showIf = showIfSchema.nullable().optional();

/** Follow-up templates a page was made from (shared/schemas/questionnaire-templates.ts). */
export const templateKindSchema = z.enum([
  'consequentiality',
  'attendance',
  'cheap_talk',
  'budget_reminder',
]);
export type TemplateKind = z.infer<typeof templateKindSchema>;

export const consentPageSchema = z.object({
  ...page,
  kind: z.literal('consent'),
  title,
  body: body.min(1, 'Write what respondents agree to'),
  agreeLabel: z.string().trim().min(1).max(200),
});
/**
 * One quota cell of a screening question: the answers it takes (options of a single-choice
 * question, or whole numbers from..to inclusive of a number question) and how many completes
 * it needs. Cells partition the accepted answers (shared/survey/quota-cells.ts checks it).
 */
export const quotaCellSchema = z.object({
  id: elementIdSchema,
  label: z.string().trim().min(1, 'Name the quota cell').max(100),
  optionIds: z.array(elementIdSchema).max(30).default([]),
  from: z.number().int('Use whole numbers').nullable().default(null),
  to: z.number().int('Use whole numbers').nullable().default(null),
  target: z
    .number()
    .int('A target is a whole number')
    .min(1, 'A target is at least 1')
    .max(1_000_000),
});
export type QuotaCell = z.infer<typeof quotaCellSchema>;

export const screeningPageSchema = z.object({
  ...page,
  kind: z.literal('screening'),
  question: questionSchema,
  /** Choice questions: choosing any of these options screens the respondent out. */
  screenOutOptionIds: z.array(elementIdSchema).default([]),
  /** Number questions: an answer outside [acceptMin, acceptMax] screens the respondent out. */
  acceptMin: z.number().finite().nullable().default(null),
  acceptMax: z.number().finite().nullable().default(null),
  showIf,
  /** Completes wanted per answer group; a full cell screens its next respondents out. */
  quotaCells: z.array(quotaCellSchema).max(20).default([]),
});
export type ScreeningPage = z.infer<typeof screeningPageSchema>;
export const questionPageSchema = z.object({
  ...page,
  kind: z.literal('question'),
  question: questionSchema,
  template: templateKindSchema.optional(),
  showIf,
});
export const instructionsPageSchema = z.object({
  ...page,
  kind: z.literal('instructions'),
  title,
  body,
  template: templateKindSchema.optional(),
  showIf,
});
/** Where the respondent's block of design tasks goes, one task per screen. */
/**
 * A certainty question under each design task ("How sure are you about this choice?"), answered
 * on a numbered scale from 1 to `points` with words at both ends. Sources in docs/methods.md
 * ("Certainty after each choice").
 */
export const certaintyScaleSchema = z.object({
  question: z.string().trim().min(1, 'Write the certainty question').max(200),
  points: z.number().int().min(3, 'Use 3 to 10 points').max(10, 'Use 3 to 10 points'),
  lowLabel: z.string().trim().min(1, 'Name the low end of the scale').max(60),
  highLabel: z.string().trim().min(1, 'Name the high end of the scale').max(60),
});
export type CertaintyScale = z.infer<typeof certaintyScaleSchema>;
export const defaultCertaintyScale = (): CertaintyScale => ({
  question: 'How sure are you about this choice?',
  points: 10,
  lowLabel: 'Not at all sure',
  highLabel: 'Completely sure',
});

export const tasksPageSchema = z.object({
  ...page,
  kind: z.literal('tasks'),
  title,
  certainty: certaintyScaleSchema.optional(),
});
export const warmupPageSchema = z.object({
  ...page,
  kind: z.literal('warmup'),
  title,
  alternatives: z.array(handSetTaskAlternativeSchema).min(2).max(5),
});
export const holdoutPageSchema = z.object({
  ...page,
  kind: z.literal('holdout'),
  title,
  alternatives: z.array(handSetTaskAlternativeSchema).min(2).max(5),
});
export const repeatPageSchema = z.object({
  ...page,
  kind: z.literal('repeat'),
  title,
  /** Which of the respondent's design tasks to repeat (1 = the first one they saw). */
  repeatOf: z.number().int().min(1).max(100),
});
export const dominancePageSchema = z.object({
  ...page,
  kind: z.literal('dominance'),
  title,
  /** The best level of every attribute (attribute id -> level id); the other alternatives get worse ones. */
  bestLevels: z.record(z.string(), elementIdSchema),
});
export const endPageSchema = z.object({ ...page, kind: z.literal('end'), title, body });

export const questionnairePageSchema = z.discriminatedUnion('kind', [
  consentPageSchema,
  screeningPageSchema,
  questionPageSchema,
  instructionsPageSchema,
  tasksPageSchema,
  warmupPageSchema,
  holdoutPageSchema,
  repeatPageSchema,
  dominancePageSchema,
  endPageSchema,
]);
export type QuestionnairePage = z.infer<typeof questionnairePageSchema>;
export type PageKind = QuestionnairePage['kind'];

/** How respondents move through the questionnaire; frozen with it into each live version. */
export const questionnaireOptionsSchema = z.object({
  /** A Back button on every screen that follows a revisable one (shared/survey/going-back.ts). */
  allowBack: z.boolean().default(true),
  /** Whether Back reaches choice tasks too; off keeps first reactions to the tasks. */
  backOnTasks: z.boolean().default(true),
  /** Each respondent sees the block's tasks in their own random order (off: design order). */
  shuffleTasks: z.boolean().default(true),
  /** Unlabeled alternatives change places per task (off: design order); labeled ones never do. */
  shuffleAlternatives: z.boolean().default(true),
  /** Each respondent gets their own attribute order, the same on every task (off: as defined). */
  shuffleAttributes: z.boolean().default(false),
});
export type QuestionnaireOptions = z.infer<typeof questionnaireOptionsSchema>;
export const defaultQuestionnaireOptions = (): QuestionnaireOptions =>
  questionnaireOptionsSchema.parse({});

export const questionnaireSchema = z
  .object({
    pages: z.array(questionnairePageSchema).min(1).max(80),
    options: questionnaireOptionsSchema.prefault({}),
  })
  .superRefine((q, ctx) => {
    const issue = (message: string, path: (string | number)[] = ['pages']) =>
      addIssue(ctx, path, message);
    const count = (kind: PageKind) => q.pages.filter((p) => p.kind === kind).length;
    if (count('consent') !== 1) issue('The questionnaire needs exactly one consent page');
    else if (q.pages[0].kind !== 'consent') issue('The consent page must come first');
    if (count('tasks') !== 1) issue('The questionnaire needs exactly one block of choice tasks');
    if (count('end') !== 1) issue('The questionnaire needs exactly one end page');
    else if (q.pages[q.pages.length - 1].kind !== 'end') issue('The end page must come last');
    const ids = q.pages.map((p) => p.id);
    if (new Set(ids).size !== ids.length) issue('Page ids must be unique');
    const keys = q.pages.flatMap((p) =>
      p.kind === 'question' || p.kind === 'screening' ? [p.question.key] : [],
    );
    keys.forEach((k, i) => {
      if (keys.indexOf(k) !== i) issue(`Two questions use the key "${k}"`);
    });
    const tasksAt = q.pages.findIndex((p) => p.kind === 'tasks');
    q.pages.forEach((p, i) => {
      if (p.kind === 'repeat' && i < tasksAt)
        issue('The repeated task must come after the choice tasks', ['pages', i]);
      if (p.kind === 'screening' && p.question.type === 'text')
        issue('Screening questions are single, multiple choice or number', ['pages', i]);
      for (const problem of skipRuleProblems(q.pages, i))
        issue(problem.message, ['pages', i, 'showIf', ...problem.path]);
      if (p.kind === 'screening')
        for (const problem of quotaProblems(p))
          issue(problem.message, ['pages', i, 'quotaCells', ...problem.path]);
    });
  });
export type Questionnaire = z.infer<typeof questionnaireSchema>;

export const updateQuestionnaireSchema = z.object({ questionnaire: questionnaireSchema });
export type UpdateQuestionnaireInput = z.input<typeof updateQuestionnaireSchema>;

/** Screen keys: how answers name the screen they belong to. */
export const screenKeys = {
  consent: () => 'consent',
  question: (key: string) => `q:${key}`,
  instructions: (pageId: string) => `page:${pageId}`,
  task: (taskNumber: number) => `task:${taskNumber}`,
  special: (kind: 'warmup' | 'holdout' | 'repeat' | 'dominance', pageId: string) =>
    `${kind}:${pageId}`,
};

export const pageKindLabels: Record<PageKind, string> = {
  consent: 'Welcome and consent',
  screening: 'Screening question',
  question: 'Background question',
  instructions: 'Instructions',
  tasks: 'Choice tasks',
  warmup: 'Warm-up task',
  holdout: 'Holdout task',
  repeat: 'Repeated task',
  dominance: 'Dominance test',
  end: 'End page',
};
