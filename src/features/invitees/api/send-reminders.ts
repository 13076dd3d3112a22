import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { SendRemindersInput, SendResult } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

/** Reminders to invitees who have not finished and have not unsubscribed. */
export function sendReminders(
  teamId: string,
  studyId: string,
  input: SendRemindersInput,
): Promise<SendResult> {
  return api.post<SendResult>(`${inviteesPath(teamId, studyId)}/remind`, input);
}

export function useSendReminders(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (input: SendRemindersInput) => sendReminders(teamId, studyId, input),
    inviteeKeys.lists(teamId, studyId),
  );
}
