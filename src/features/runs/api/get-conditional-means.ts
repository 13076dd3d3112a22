import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { ConditionalMeans } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

export const getConditionalMeansQueryOptions = (teamId: string, studyId: string, runId: string) =>
  queryOptions({
    ...apiQueryOptions<ConditionalMeans>(
      runKeys.conditionalMeans(teamId, studyId, runId),
      `${runsPath(teamId, studyId)}/${runId}/conditional-means`,
    ),
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
