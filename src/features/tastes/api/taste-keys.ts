/** Query keys of the tastes feature, broad to narrow. */
import type { ListTastesQuery } from '@shared/schemas/tastes';
import { studyScopedKeys } from '@/lib/study-scoped-keys';

export type SegmentsParams = {
  runId: string;
  coefficient: string;
  groupBy: 'task' | 'question' | 'class';
  task?: number;
  question?: string;
};

export const tasteKeys = {
  ...studyScopedKeys('tastes'),
  runs: (teamId: string, studyId: string) => [...tasteKeys.study(teamId, studyId), 'runs'] as const,
  lists: (teamId: string, studyId: string) =>
    [...tasteKeys.study(teamId, studyId), 'list'] as const,
  list: (teamId: string, studyId: string, query: Partial<ListTastesQuery>) =>
    [...tasteKeys.lists(teamId, studyId), query] as const,
  segments: (teamId: string, studyId: string, params: SegmentsParams) =>
    [...tasteKeys.study(teamId, studyId), 'segments', params] as const,
  comparison: (teamId: string, studyId: string, runId: string, otherRunId: string) =>
    [...tasteKeys.study(teamId, studyId), 'comparison', runId, otherRunId] as const,
  respondent: (teamId: string, studyId: string, runId: string, respondentId: string) =>
    [...tasteKeys.study(teamId, studyId), 'respondent', runId, respondentId] as const,
};

export const tastesPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/tastes`;
