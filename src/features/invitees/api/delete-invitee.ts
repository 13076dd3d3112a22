import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export function deleteInvitee(teamId: string, studyId: string, inviteeId: string): Promise<void> {
  return api.delete<void>(`${inviteesPath(teamId, studyId)}/${inviteeId}`);
}

export function useDeleteInvitee(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (inviteeId: string) => deleteInvitee(teamId, studyId, inviteeId),
    onSuccess: () => qc.invalidateQueries({ queryKey: inviteeKeys.lists(teamId, studyId) }),
  });
}
