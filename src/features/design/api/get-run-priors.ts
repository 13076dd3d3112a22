import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PriorSpread, RunPriors } from '@shared/schemas/redesign';
import { designKeys } from './design-keys';

export function getRunPriors(
  teamId: string,
  studyId: string,
  runId: string,
  spread: PriorSpread,
  signal?: AbortSignal,
) {
  const query = new URLSearchParams({ runId, spread });
  return api.get<RunPriors>(
    `/teams/${teamId}/studies/${studyId}/design/priors-from-run?${query}`,
    signal,
  );
}

export const getRunPriorsQueryOptions = (
  teamId: string,
  studyId: string,
  runId: string,
  spread: PriorSpread,
) =>
  queryOptions({
    queryKey: designKeys.runPriors(teamId, studyId, runId, spread),
    queryFn: ({ signal }) => getRunPriors(teamId, studyId, runId, spread, signal),
    retry: false,
  });

/** The run's estimates as priors; idle until a run is chosen. */
export function useRunPriors(teamId: string, studyId: string, runId: string, spread: PriorSpread) {
  return useQuery({
    ...getRunPriorsQueryOptions(teamId, studyId, runId, spread),
    enabled: runId !== '',
  });
}
