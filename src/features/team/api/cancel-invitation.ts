import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

type Params = { teamId: string; invitationId: string };

export const cancelInvitation = ({ teamId, invitationId }: Params) =>
  api.delete<void>(`/teams/${teamId}/invitations/${invitationId}`);

export function useCancelInvitation() {
  return useRefreshingMutation(cancelInvitation, (params) => teamKeys.invitations(params.teamId));
}
