import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InviteeCsvPreview } from '@shared/schemas/invitees';
import { inviteesPath } from './invitee-keys';

/** Reads the file on the server and reports what an import would do; nothing is saved. */
export function previewInvitees(
  teamId: string,
  studyId: string,
  file: File,
): Promise<InviteeCsvPreview> {
  const form = new FormData();
  form.append('file', file);
  return api.upload<InviteeCsvPreview>(`${inviteesPath(teamId, studyId)}/preview`, form);
}

export function usePreviewInvitees(teamId: string, studyId: string) {
  return useMutation({ mutationFn: (file: File) => previewInvitees(teamId, studyId, file) });
}
