import { pgEnum } from 'drizzle-orm/pg-core';

export const roleEnum = pgEnum('team_role', ['owner', 'editor', 'analyst', 'viewer']);
export const studyStatusEnum = pgEnum('study_status', ['draft', 'live', 'closed']);
export const jobStatusEnum = pgEnum('job_status', [
  'queued',
  'running',
  'done',
  'failed',
  'cancelled',
]);
export const respondentStatusEnum = pgEnum('respondent_status', [
  'in_progress',
  'completed',
  'screened_out',
  'over_quota',
]);
