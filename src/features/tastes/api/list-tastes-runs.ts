import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { TastesRun } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

/** Finished runs of the study, newest first, with their numbers of taste profiles. */
export const listTastesRunsQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<TastesRun[]>(
    tasteKeys.runs(teamId, studyId),
    `${tastesPath(teamId, studyId)}/runs`,
  );

export function useTastesRuns(teamId: string, studyId: string) {
  return useQuery(listTastesRunsQueryOptions(teamId, studyId));
}
