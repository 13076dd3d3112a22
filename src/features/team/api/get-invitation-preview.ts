import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { InvitationPreview } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

/** What the invitee sees before accepting; works without signing in. */
export const getInvitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    ...apiQueryOptions<InvitationPreview>(
      teamKeys.invitationPreview(token),
      `/invitations/${encodeURIComponent(token)}`,
    ),
    // A used link stays used: no refetch that would turn the page into an error after accepting.
    staleTime: Infinity,
  });

export function useInvitationPreview(token: string) {
  return useQuery(getInvitationPreviewQueryOptions(token));
}
