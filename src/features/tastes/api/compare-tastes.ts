import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFilteredQueryOptions } from '@/lib/api-query-options';
import type { TasteComparison } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

/** Two runs' individual means per coefficient, matched by respondent, with correlations. */
export const compareTastesQueryOptions = (
  teamId: string,
  studyId: string,
  runId: string,
  otherRunId: string,
) =>
  queryOptions({
    ...apiFilteredQueryOptions<TasteComparison>(
      tasteKeys.comparison(teamId, studyId, runId, otherRunId),
      `${tastesPath(teamId, studyId)}/compare`,
      { runId, otherRunId },
    ),
    enabled: runId !== '' && otherRunId !== '' && runId !== otherRunId,
  });

export function useTasteComparison(
  teamId: string,
  studyId: string,
  runId: string,
  otherRunId: string,
) {
  return useQuery(compareTastesQueryOptions(teamId, studyId, runId, otherRunId));
}
