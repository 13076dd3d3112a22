import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Run } from '@shared/schemas/run';
import { isRunActive, POLL_MS, runKeys, runsPath } from './run-keys';

export const listRunsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    ...apiQueryOptions<Run[]>(runKeys.lists(teamId, studyId), runsPath(teamId, studyId)),
    refetchInterval: (query) =>
      query.state.data?.some((r) => isRunActive(r.status)) ? POLL_MS : false,
  });

export function useRuns(teamId: string, studyId: string) {
  return useQuery(listRunsQueryOptions(teamId, studyId));
}
