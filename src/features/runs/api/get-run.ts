import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Run } from '@shared/schemas/run';
import { isRunActive, POLL_MS, runKeys, runsPath } from './run-keys';

export const getRunQueryOptions = (teamId: string, studyId: string, runId: string) =>
  queryOptions({
    ...apiQueryOptions<Run>(
      runKeys.detail(teamId, studyId, runId),
      `${runsPath(teamId, studyId)}/${runId}`,
    ),
    refetchInterval: (query) =>
      query.state.data && isRunActive(query.state.data.status) ? POLL_MS : false,
  });

export function useRun(teamId: string, studyId: string, runId: string) {
  return useQuery(getRunQueryOptions(teamId, studyId, runId));
}
