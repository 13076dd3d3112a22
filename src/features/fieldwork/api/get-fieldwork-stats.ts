import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { fieldworkKeys, fieldworkPath, LIVE_REFRESH_MS } from './fieldwork-keys';

export const getFieldworkStatsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    ...apiQueryOptions<FieldworkStats>(
      fieldworkKeys.stats(teamId, studyId),
      fieldworkPath(teamId, studyId),
    ),
    staleTime: 5_000,
    refetchInterval: (query) => (query.state.data?.status === 'live' ? LIVE_REFRESH_MS : false),
  });

export function useFieldworkStats(teamId: string, studyId: string) {
  return useQuery(getFieldworkStatsQueryOptions(teamId, studyId));
}
