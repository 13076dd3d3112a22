import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Member } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

export const getMembers = (teamId: string, signal?: AbortSignal) =>
  api.get<Member[]>(`/teams/${teamId}/members`, signal);

export const getMembersQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: teamKeys.members(teamId),
    queryFn: ({ signal }) => getMembers(teamId, signal),
  });

export function useMembers(teamId: string) {
  return useQuery(getMembersQueryOptions(teamId));
}
