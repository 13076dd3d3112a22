import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Invitation } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

/** Open invitations of a team (owners only). */
export const getInvitationsQueryOptions = (teamId: string) =>
  apiQueryOptions<Invitation[]>(teamKeys.invitations(teamId), `/teams/${teamId}/invitations`);

export function useInvitations(teamId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getInvitationsQueryOptions(teamId), enabled: options.enabled ?? true });
}
