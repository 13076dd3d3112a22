import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the shares feature, broad to narrow. */
export type ShareGroupsParams = {
  runId: string;
  groupBy: 'task' | 'question' | 'class';
  task?: number;
  question?: string;
};

export const shareKeys = {
  ...studyScopedKeys('shares'),
  model: (teamId: string, studyId: string, runId: string) =>
    [...shareKeys.study(teamId, studyId), 'model', runId] as const,
  groups: (teamId: string, studyId: string, params: ShareGroupsParams) =>
    [...shareKeys.study(teamId, studyId), 'groups', params] as const,
  scenarios: (teamId: string, studyId: string) =>
    [...shareKeys.study(teamId, studyId), 'scenarios'] as const,
};

export const sharesPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/shares`;
