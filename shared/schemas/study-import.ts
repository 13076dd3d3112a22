/**
 * Creating a study from choice data collected elsewhere: the long-format choice file (one row
 * per alternative, the columns the command-line estimator reads), an optional file of
 * background answers per respondent, and the attribute set-up the researcher confirms after
 * the preview has inferred it from the columns. Format and checks: docs/methods.md, "Imported
 * choice data".
 */
import { z } from 'zod';
import { DESIGN_MAX_TASKS } from './design';
import { codingSchema } from './study-definition';
import { questionKeySchema } from './questionnaire';

/** Largest upload per file by default (the server's IMPORT_MAX_MB; 413 above it). */
export const IMPORT_MAX_BYTES = 256 * 1024 * 1024;
/** Most data lines in a choice file. */
export const IMPORT_MAX_ROWS = 5_000_000;
/**
 * Most distinct choice sets (a task's alternatives with their levels, in order): a study
 * stores each distinct set once, as a task of the imported design, and respondents point at
 * them, so a design's task limit applies.
 */
export const IMPORT_MAX_CHOICE_SETS = DESIGN_MAX_TASKS;
/** Problems listed in a preview or an error (all are counted). */
export const IMPORT_MAX_PROBLEMS_LISTED = 200;

/** Columns every choice file has (as the command-line estimator reads them). */
export const choiceFileKeyColumns = ['respondent', 'task', 'alt', 'chosen'] as const;
/** Columns the estimator reads that an import does not take (holdout and inclusion flags). */
export const choiceFileUnsupportedColumns = ['holdout', 'included'] as const;

export const importProblemCodeSchema = z.enum([
  'unreadable',
  'missing_column',
  'field_count',
  'empty_key',
  'chosen_not_binary',
  'chosen_count',
  'alternative_count',
  'duplicate_row',
  'inconsistent_attributes',
  'not_numeric',
  'unknown_level',
  'too_many_levels',
  'too_many_rows',
  'too_many_choice_sets',
  'unsupported_column',
  'background_unknown_respondent',
  'background_duplicate_respondent',
]);
export type ImportProblemCode = z.infer<typeof importProblemCodeSchema>;

/** One problem, with the file, its line (the header is line 1) and column where it has one. */
export const importProblemSchema = z.object({
  file: z.enum(['choices', 'background']),
  line: z.number().int().min(1).nullable(),
  column: z.string().nullable(),
  code: importProblemCodeSchema,
  message: z.string(),
});
export type ImportProblem = z.infer<typeof importProblemSchema>;

/** A level as the file writes it (`raw`), with what the study shows and, if numeric, its value. */
export const importLevelSchema = z.object({
  raw: z.string().max(120),
  label: z.string().trim().max(120).default(''),
  value: z.number().finite().optional(),
});
export type ImportLevel = z.infer<typeof importLevelSchema>;

export const importAttributeSchema = z.object({
  /** The column of the choice file that holds this attribute. */
  column: z.string().min(1).max(120),
  name: z.string().trim().min(1, 'An attribute needs a name').max(120),
  kind: z.enum(['categorical', 'numeric']),
  coding: codingSchema,
  isCost: z.boolean().default(false),
  unit: z.string().max(40).optional(),
  levels: z.array(importLevelSchema).min(2, 'An attribute needs at least 2 levels').max(12),
  /** Dummy coding: the `raw` of the level left out (defaults to the first). */
  referenceRaw: z.string().max(120).optional(),
});
export type ImportAttribute = z.infer<typeof importAttributeSchema>;

export const importBackgroundColumnSchema = z.object({
  column: z.string().min(1).max(120),
  key: questionKeySchema,
  text: z.string().trim().min(1).max(300),
  type: z.enum(['number', 'single']),
});
export type ImportBackgroundColumn = z.infer<typeof importBackgroundColumnSchema>;

/** What the researcher confirms before saving (sent as the `setup` field, JSON). */
export const importSetupSchema = z.object({
  name: z.string().trim().min(1, 'Give the study a name').max(160),
  description: z.string().trim().max(2000).default(''),
  attributes: z.array(importAttributeSchema).min(1, 'Keep at least one attribute').max(20),
});
export type ImportSetup = z.infer<typeof importSetupSchema>;
export type ImportSetupInput = z.input<typeof importSetupSchema>;

/** The `setup` multipart field: JSON text holding an ImportSetup. */
export const importSetupFieldSchema = z.object({
  setup: z
    .string()
    .max(200_000)
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: 'The set-up is not valid JSON' });
        return z.NEVER;
      }
    })
    .pipe(importSetupSchema),
});
/** The preview may be checked against an edited set-up (optional). */
export const importPreviewFieldsSchema = importSetupFieldSchema.partial();

export type ImportPreview = {
  rows: number;
  respondents: number;
  tasks: number;
  /** Alternatives per task (the most common count). */
  alternativesPerTask: number;
  choiceSets: number;
  columns: string[];
  /** Attributes inferred from the columns, or the set-up sent, checked. */
  attributes: ImportAttribute[];
  background: { columns: ImportBackgroundColumn[]; respondents: number } | null;
  problemCount: number;
  /** The first IMPORT_MAX_PROBLEMS_LISTED problems, by file and line. */
  problems: ImportProblem[];
};

export type ImportResult = {
  studyId: string;
  respondents: number;
  tasks: number;
  rows: number;
};
