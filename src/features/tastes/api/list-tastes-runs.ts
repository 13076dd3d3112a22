import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TastesRun } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

/** Finished runs of the study, newest first, with their numbers of taste profiles. */
export function listTastesRuns(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<TastesRun[]>(`${tastesPath(teamId, studyId)}/runs`, signal);
}

export const listTastesRunsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: tasteKeys.runs(teamId, studyId),
    queryFn: ({ signal }) => listTastesRuns(teamId, studyId, signal),
  });

export function useTastesRuns(teamId: string, studyId: string) {
  return useQuery(listTastesRunsQueryOptions(teamId, studyId));
}
