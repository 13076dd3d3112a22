import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Run } from '@shared/schemas/run';
import { isRunActive, POLL_MS, runKeys, runsPath } from './run-keys';

export function listRuns(teamId: string, studyId: string, signal?: AbortSignal): Promise<Run[]> {
  return api.get<Run[]>(runsPath(teamId, studyId), signal);
}

export const listRunsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: runKeys.lists(teamId, studyId),
    queryFn: ({ signal }) => listRuns(teamId, studyId, signal),
    refetchInterval: (query) =>
      query.state.data?.some((r) => isRunActive(r.status)) ? POLL_MS : false,
  });

export function useRuns(teamId: string, studyId: string) {
  return useQuery(listRunsQueryOptions(teamId, studyId));
}
