import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ConditionalMeans } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

export function getConditionalMeans(
  teamId: string,
  studyId: string,
  runId: string,
  signal?: AbortSignal,
): Promise<ConditionalMeans> {
  return api.get<ConditionalMeans>(
    `${runsPath(teamId, studyId)}/${runId}/conditional-means`,
    signal,
  );
}

export const getConditionalMeansQueryOptions = (teamId: string, studyId: string, runId: string) =>
  queryOptions({
    queryKey: runKeys.conditionalMeans(teamId, studyId, runId),
    queryFn: ({ signal }) => getConditionalMeans(teamId, studyId, runId, signal),
    staleTime: Infinity,
  });

export function useConditionalMeans(
  teamId: string,
  studyId: string,
  runId: string,
  enabled: boolean,
) {
  return useQuery({ ...getConditionalMeansQueryOptions(teamId, studyId, runId), enabled });
}
