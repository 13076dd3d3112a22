import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the lifecycle feature, broad to narrow. */
export const lifecycleKeys = {
  ...studyScopedKeys('lifecycle'),
  state: (teamId: string, studyId: string) =>
    [...lifecycleKeys.study(teamId, studyId), 'state'] as const,
  readiness: (teamId: string, studyId: string) =>
    [...lifecycleKeys.study(teamId, studyId), 'readiness'] as const,
  versions: (teamId: string, studyId: string) =>
    [...lifecycleKeys.study(teamId, studyId), 'versions'] as const,
};

export const lifecycleBase = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/lifecycle`;
