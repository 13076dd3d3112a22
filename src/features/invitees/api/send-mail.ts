import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { SendInvitationsInput, SendResult } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

/**
 * Mail to the study's invitees (everybody who qualifies, or the given ids), then the list
 * refreshed: `send` for first invitations to those not invited yet, `remind` for reminders to
 * those who have not finished and have not unsubscribed. Both take the same wording.
 */
function useSendMail(teamId: string, studyId: string, action: 'send' | 'remind') {
  return useRefreshingMutation(
    (input: SendInvitationsInput) =>
      api.post<SendResult>(`${inviteesPath(teamId, studyId)}/${action}`, input),
    inviteeKeys.lists(teamId, studyId),
  );
}

export const useSendInvitations = (teamId: string, studyId: string) =>
  useSendMail(teamId, studyId, 'send');

export const useSendReminders = (teamId: string, studyId: string) =>
  useSendMail(teamId, studyId, 'remind');
