import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RunOptions } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

/** Coded columns, respondent count and saved filters the Models form offers. */
export function getRunOptions(
  teamId: string,
  studyId: string,
  signal?: AbortSignal,
): Promise<RunOptions> {
  return api.get<RunOptions>(`${runsPath(teamId, studyId)}/options`, signal);
}

export const getRunOptionsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: runKeys.options(teamId, studyId),
    queryFn: ({ signal }) => getRunOptions(teamId, studyId, signal),
  });

export function useRunOptions(teamId: string, studyId: string) {
  return useQuery(getRunOptionsQueryOptions(teamId, studyId));
}
