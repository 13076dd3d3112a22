import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TeamSummary } from '@shared/schemas/auth';
import { teamKeys } from './team-keys';

export const getMyTeams = (signal?: AbortSignal) => api.get<TeamSummary[]>('/teams', signal);

export const getMyTeamsQueryOptions = () =>
  queryOptions({ queryKey: teamKeys.lists(), queryFn: ({ signal }) => getMyTeams(signal) });

export function useMyTeams() {
  return useQuery(getMyTeamsQueryOptions());
}
