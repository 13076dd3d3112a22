import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TasteComparison } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath, toSearch } from './taste-keys';

/** Two runs' individual means per coefficient, matched by respondent, with correlations. */
export function compareTastes(
  teamId: string,
  studyId: string,
  runId: string,
  otherRunId: string,
  signal?: AbortSignal,
) {
  return api.get<TasteComparison>(
    `${tastesPath(teamId, studyId)}/compare?${toSearch({ runId, otherRunId })}`,
    signal,
  );
}

export const compareTastesQueryOptions = (
  teamId: string,
  studyId: string,
  runId: string,
  otherRunId: string,
) =>
  queryOptions({
    queryKey: tasteKeys.comparison(teamId, studyId, runId, otherRunId),
    queryFn: ({ signal }) => compareTastes(teamId, studyId, runId, otherRunId, signal),
    placeholderData: keepPreviousData,
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
