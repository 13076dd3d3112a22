import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Invitation } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

/** Open invitations of a team (owners only). */
export const getInvitations = (teamId: string, signal?: AbortSignal) =>
  api.get<Invitation[]>(`/teams/${teamId}/invitations`, signal);

export const getInvitationsQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: teamKeys.invitations(teamId),
    queryFn: ({ signal }) => getInvitations(teamId, signal),
  });

export function useInvitations(teamId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getInvitationsQueryOptions(teamId), enabled: options.enabled ?? true });
}
