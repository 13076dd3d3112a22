/**
 * The Responses section: respondents with their automatic quality flags and the include /
 * exclude decisions kept for estimation. External ids and e-mail addresses are personal data:
 * the server leaves them out of every answer to a role without personal:read.
 */
import { z } from 'zod';
import { languageTagSchema } from './study-texts';

export const qualityFlagKeys = [
  'speeder',
  'samePosition',
  'alwaysFixed',
  'dominanceFailed',
  'inconsistent',
] as const;
export const qualityFlagKeySchema = z.enum(qualityFlagKeys);
export type QualityFlagKey = z.infer<typeof qualityFlagKeySchema>;

/** true = flagged, false = checked and fine, null = could not be checked (see the labels). */
export const qualityFlagsSchema = z.object({
  speeder: z.boolean().nullable(),
  samePosition: z.boolean().nullable(),
  alwaysFixed: z.boolean().nullable(),
  dominanceFailed: z.boolean().nullable(),
  inconsistent: z.boolean().nullable(),
});
export type QualityFlags = z.infer<typeof qualityFlagsSchema>;

export const qualityFlagLabels: Record<QualityFlagKey, { label: string; help: string }> = {
  speeder: {
    label: 'Speeder',
    help: 'Total time under the set fraction of the median time of completed respondents.',
  },
  samePosition: {
    label: 'Same position',
    help: 'Chose the card at the same position in every choice task.',
  },
  alwaysFixed: {
    label: 'Always status quo / opt-out',
    help: 'Chose the fixed alternative in every choice task (possible protest or no trade-off).',
  },
  dominanceFailed: {
    label: 'Failed dominance test',
    help: 'Chose a worse alternative in the dominance test task.',
  },
  inconsistent: {
    label: 'Inconsistent repeat',
    help: 'Chose differently when the same task was shown again.',
  },
};

/**
 * Speeders: total time below this fraction of the median. 0.5 is common practice, no source
 * (docs/methods.md, "Fieldwork, quality flags").
 */
export const DEFAULT_SPEEDER_FRACTION = 0.5;

export const qualitySettingsSchema = z.object({
  speederFraction: z
    .number('Enter a fraction between 0.1 and 0.9')
    .min(0.1, 'Use a fraction of at least 0.1')
    .max(0.9, 'Use a fraction of at most 0.9')
    .default(DEFAULT_SPEEDER_FRACTION),
});
export type QualitySettings = z.infer<typeof qualitySettingsSchema>;
export const updateQualitySettingsSchema = qualitySettingsSchema.required();
export type UpdateQualitySettingsInput = z.input<typeof updateQualitySettingsSchema>;

export const respondentStatusSchema = z.enum([
  'in_progress',
  'completed',
  'screened_out',
  'over_quota',
]);

export const responseRowSchema = z.object({
  id: z.uuid(),
  status: respondentStatusSchema,
  version: z.number().int(),
  block: z.number().int(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  durationMs: z.number().int().nullable(),
  flags: qualityFlagsSchema,
  included: z.boolean(),
  exclusionReason: z.string().nullable(),
  device: z.string(),
  /** The language the respondent answered in (BCP 47). */
  language: z.string(),
  /** Only for roles with personal:read. */
  externalId: z.string().nullable().optional(),
  email: z.string().nullable().optional(),
});
export type ResponseRow = z.infer<typeof responseRowSchema>;

export const listResponsesQuerySchema = z.object({
  status: respondentStatusSchema.optional(),
  /** "any" = at least one flag; or one flag key. */
  flag: z.union([z.literal('any'), qualityFlagKeySchema]).optional(),
  included: z.enum(['true', 'false']).optional(),
  /** Respondents who answered in this language. */
  language: languageTagSchema.optional(),
  sort: z.enum(['started', 'duration']).default('started'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type ListResponsesQuery = z.infer<typeof listResponsesQuerySchema>;

export const responsesSummarySchema = z.object({
  respondents: z.number().int(),
  completed: z.number().int(),
  included: z.number().int(),
  excluded: z.number().int(),
  flagged: z.record(qualityFlagKeySchema, z.number().int()),
  /** Respondents with at least one flag (the table's "any flag" filter shows the same ones). */
  anyFlag: z.number().int(),
  medianDurationMs: z.number().nullable(),
  /** Below this total time a completed respondent is flagged as a speeder. */
  speederThresholdMs: z.number().nullable(),
});
export type ResponsesSummary = z.infer<typeof responsesSummarySchema>;

export const responseListSchema = z.object({
  items: z.array(responseRowSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  summary: responsesSummarySchema,
  settings: qualitySettingsSchema,
  /** Whether this caller receives external ids and e-mail addresses. */
  personalData: z.boolean(),
  /** The study's languages (the filter offers them when there are several). */
  languages: z.array(z.string()),
});
export type ResponseList = z.infer<typeof responseListSchema>;

const reason = z
  .string()
  .trim()
  .min(3, 'Say why (at least 3 characters)')
  .max(500, 'Keep the reason under 500 characters');

export const setInclusionSchema = z.discriminatedUnion('included', [
  z.object({ included: z.literal(true) }),
  z.object({ included: z.literal(false), reason }),
]);
export type SetInclusionInput = z.infer<typeof setInclusionSchema>;

export const excludeFlaggedSchema = z.object({
  flags: z.array(qualityFlagKeySchema).min(1, 'Choose at least one flag').max(5),
  reason,
});
export type ExcludeFlaggedInput = z.infer<typeof excludeFlaggedSchema>;

export const excludeFlaggedResultSchema = z.object({ excluded: z.number().int() });

export const respondentParamsSchema = z.object({
  teamId: z.uuid(),
  studyId: z.uuid(),
  respondentId: z.uuid('Unknown respondent'),
});
