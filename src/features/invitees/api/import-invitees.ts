import { useMutation, useQueryClient } from '@tanstack/react-query';
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
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { file: File; onlyValid: boolean }) =>
      importInvitees(teamId, studyId, v.file, v.onlyValid),
    onSuccess: () => qc.invalidateQueries({ queryKey: inviteeKeys.lists(teamId, studyId) }),
  });
}
