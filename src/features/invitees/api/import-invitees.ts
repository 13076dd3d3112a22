import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { ImportInviteesResult } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export function importInvitees(
  teamId: string,
  studyId: string,
  file: File,
  onlyValid: boolean,
): Promise<ImportInviteesResult> {
  const form = new FormData();
  form.append('onlyValid', String(onlyValid));
  form.append('file', file);
  return api.upload<ImportInviteesResult>(`${inviteesPath(teamId, studyId)}/import`, form);
}

export function useImportInvitees(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (v: { file: File; onlyValid: boolean }) => importInvitees(teamId, studyId, v.file, v.onlyValid),
    inviteeKeys.lists(teamId, studyId),
  );
}
