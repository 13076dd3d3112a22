import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { RunOptions } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

/** Coded columns, respondent count and saved filters the Models form offers. */
export const getRunOptionsQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<RunOptions>(
    runKeys.options(teamId, studyId),
    `${runsPath(teamId, studyId)}/options`,
  );

export function useRunOptions(teamId: string, studyId: string) {
  return useQuery(getRunOptionsQueryOptions(teamId, studyId));
}
