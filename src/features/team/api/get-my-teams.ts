import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { TeamSummary } from '@shared/schemas/auth';
import { teamKeys } from './team-keys';

export const getMyTeamsQueryOptions = () =>
  apiQueryOptions<TeamSummary[]>(teamKeys.lists(), '/teams');

export function useMyTeams() {
  return useQuery(getMyTeamsQueryOptions());
}
