import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { languageKeys } from '@/features/languages/api/language-keys';
import type { Study, UpdateStudyInput } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export function updateStudy(teamId: string, studyId: string, input: UpdateStudyInput) {
  return api.patch<Study>(`/teams/${teamId}/studies/${studyId}`, input);
}

export function useUpdateStudy(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateStudyInput) => updateStudy(teamId, studyId, input),
    onSuccess: (study) => {
      qc.setQueryData(studyKeys.detail(teamId, studyId), study);
      void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
      // The source wordings changed: translations of them may be stale now.
      void qc.invalidateQueries({ queryKey: languageKeys.texts(teamId, studyId) });
    },
  });
}
