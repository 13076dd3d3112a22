import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type UploadedFile = { key: string; url: string; contentType: string; sizeBytes: number };

export function uploadLevelImage(teamId: string, studyId: string, file: File) {
  const form = new FormData();
  form.append('file', file);
  return api.upload<UploadedFile>(`/teams/${teamId}/studies/${studyId}/files`, form);
}

export function useUploadLevelImage(teamId: string, studyId: string) {
  return useMutation({ mutationFn: (file: File) => uploadLevelImage(teamId, studyId, file) });
}
