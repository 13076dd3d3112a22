import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

type Params = { teamId: string; invitationId: string };

export const cancelInvitation = ({ teamId, invitationId }: Params) =>
  api.delete<void>(`/teams/${teamId}/invitations/${invitationId}`);

export function useCancelInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: cancelInvitation,
    onSuccess: (_data, params) =>
      qc.invalidateQueries({ queryKey: teamKeys.invitations(params.teamId) }),
  });
}
