import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { fieldworkKeys, fieldworkPath, LIVE_REFRESH_MS } from './fieldwork-keys';

export function getFieldworkStats(
  teamId: string,
  studyId: string,
  signal?: AbortSignal,
): Promise<FieldworkStats> {
  return api.get<FieldworkStats>(fieldworkPath(teamId, studyId), signal);
}

export const getFieldworkStatsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: fieldworkKeys.stats(teamId, studyId),
    queryFn: ({ signal }) => getFieldworkStats(teamId, studyId, signal),
    staleTime: 5_000,
    refetchInterval: (query) => (query.state.data?.status === 'live' ? LIVE_REFRESH_MS : false),
  });

export function useFieldworkStats(teamId: string, studyId: string) {
  return useQuery(getFieldworkStatsQueryOptions(teamId, studyId));
}
