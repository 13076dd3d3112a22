import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { designKeys } from './design-keys';
import type { StudyDesignState } from './get-design-state';

export function importDesign(teamId: string, studyId: string, file: File) {
  const form = new FormData();
  form.append('file', file);
  return api.upload<StudyDesignState>(`/teams/${teamId}/studies/${studyId}/design/import`, form);
}

export function useImportDesign(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => importDesign(teamId, studyId, file),
    onSuccess: (state) => qc.setQueryData(designKeys.state(teamId, studyId), state),
  });
}
