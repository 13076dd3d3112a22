/**
 * Studies as the API shows them: the list entry with its counts, the full study with its
 * definition, and the inputs to create, rename, archive and edit the definition.
 */
import { z } from 'zod';
import { studyDefinitionSchema, type StudyDefinition } from './study-definition';

export const studyStatusSchema = z.enum(['draft', 'live', 'closed']);
export type StudyStatus = z.infer<typeof studyStatusSchema>;

const studyName = z.string().trim().min(1, 'Give the study a name').max(160);
/** The title respondents see on the survey and in invitation e-mails. */
export const publicTitleSchema = z
  .string()
  .trim()
  .min(1, 'Give the study a title for respondents')
  .max(160);

export const createStudySchema = z.object({
  name: studyName,
  /** Defaults to the name; change it when the name is for the team only. */
  publicTitle: publicTitleSchema.optional(),
  description: z.string().trim().max(2000).default(''),
});
export type CreateStudyInput = z.input<typeof createStudySchema>;

export const studyDetailsSchema = z.object({
  name: studyName,
  publicTitle: publicTitleSchema,
  description: z.string().trim().max(2000),
});

export const updateStudySchema = studyDetailsSchema
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change' });
export type UpdateStudyInput = z.input<typeof updateStudySchema>;

export const archiveStudySchema = z.object({ archived: z.boolean() });

export const listStudiesQuerySchema = z.object({
  archived: z.enum(['true', 'false']).default('false'),
});

export const updateDefinitionSchema = z.object({ definition: studyDefinitionSchema });
export type UpdateDefinitionInput = z.input<typeof updateDefinitionSchema>;

export type StudyCounts = {
  attributes: number;
  tasks: number;
  blocks: number;
  respondents: number;
};

export type StudySummary = {
  id: string;
  publicId: string;
  name: string;
  /** What respondents see; `name` is internal to the team. */
  publicTitle: string;
  description: string;
  status: StudyStatus;
  /** 'imported': created from a choice file (no fieldwork, never live). */
  source: 'fielded' | 'imported';
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
  counts: StudyCounts;
};

export type Study = StudySummary & {
  definition: StudyDefinition;
  questionnaire: unknown;
  currentDesignId: string | null;
  currentVersion: number;
};
