import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export function deleteInvitee(teamId: string, studyId: string, inviteeId: string): Promise<void> {
  return api.delete<void>(`${inviteesPath(teamId, studyId)}/${inviteeId}`);
}

export function useDeleteInvitee(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (inviteeId: string) => deleteInvitee(teamId, studyId, inviteeId),
    inviteeKeys.lists(teamId, studyId),
  );
}
