import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { SendInvitationsInput, SendResult } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

/** First invitations to everybody on the list who has not been invited (or the given ids). */
export function sendInvitations(
  teamId: string,
  studyId: string,
  input: SendInvitationsInput,
): Promise<SendResult> {
  return api.post<SendResult>(`${inviteesPath(teamId, studyId)}/send`, input);
}

export function useSendInvitations(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (input: SendInvitationsInput) => sendInvitations(teamId, studyId, input),
    inviteeKeys.lists(teamId, studyId),
  );
}
