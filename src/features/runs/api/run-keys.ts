import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the runs feature, broad to narrow. */
export const runKeys = {
  ...studyScopedKeys('runs'),
  lists: (teamId: string, studyId: string) => [...runKeys.study(teamId, studyId), 'list'] as const,
  options: (teamId: string, studyId: string) =>
    [...runKeys.study(teamId, studyId), 'options'] as const,
  detail: (teamId: string, studyId: string, runId: string) =>
    [...runKeys.study(teamId, studyId), 'detail', runId] as const,
  conditionalMeans: (teamId: string, studyId: string, runId: string) =>
    [...runKeys.detail(teamId, studyId, runId), 'conditional-means'] as const,
};

export const runsPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/runs`;

/** Queued and running runs are polled; finished ones never change. */
export const isRunActive = (status: string) => status === 'queued' || status === 'running';
export const POLL_MS = 1000;
