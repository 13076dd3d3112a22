import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Run } from '@shared/schemas/run';
import { isRunActive, POLL_MS, runKeys, runsPath } from './run-keys';

export function getRun(
  teamId: string,
  studyId: string,
  runId: string,
  signal?: AbortSignal,
): Promise<Run> {
  return api.get<Run>(`${runsPath(teamId, studyId)}/${runId}`, signal);
}

export const getRunQueryOptions = (teamId: string, studyId: string, runId: string) =>
  queryOptions({
    queryKey: runKeys.detail(teamId, studyId, runId),
    queryFn: ({ signal }) => getRun(teamId, studyId, runId, signal),
    refetchInterval: (query) =>
      query.state.data && isRunActive(query.state.data.status) ? POLL_MS : false,
  });

export function useRun(teamId: string, studyId: string, runId: string) {
  return useQuery(getRunQueryOptions(teamId, studyId, runId));
}
