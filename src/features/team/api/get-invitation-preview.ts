import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InvitationPreview } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

/** What the invitee sees before accepting; works without signing in. */
export const getInvitationPreview = (token: string, signal?: AbortSignal) =>
  api.get<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`, signal);

export const getInvitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: teamKeys.invitationPreview(token),
    queryFn: ({ signal }) => getInvitationPreview(token, signal),
    // A used link stays used: no refetch that would turn the page into an error after accepting.
    staleTime: Infinity,
  });

export function useInvitationPreview(token: string) {
  return useQuery(getInvitationPreviewQueryOptions(token));
}
