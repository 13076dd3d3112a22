import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Member } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

export const getMembersQueryOptions = (teamId: string) =>
  apiQueryOptions<Member[]>(teamKeys.members(teamId), `/teams/${teamId}/members`);

export function useMembers(teamId: string) {
  return useQuery(getMembersQueryOptions(teamId));
}
