import { z } from 'zod';

/**
 * The path parameters of every study-scoped route: the team and the study. Routes under a study
 * extend it with their own id (a run, a scenario, a design job …), so a bad study id is reported
 * the same way everywhere.
 */
export const studyParamsSchema = z.object({ teamId: z.uuid(), studyId: z.uuid('Unknown study') });
