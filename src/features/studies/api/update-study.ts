import { useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { languageKeys } from '@/features/languages/api/language-keys';
import type { Study, UpdateStudyInput } from '@shared/schemas/study';
import { useStudyMutation } from './use-study-mutation';

export function updateStudy(teamId: string, studyId: string, input: UpdateStudyInput) {
  return api.patch<Study>(`/teams/${teamId}/studies/${studyId}`, input);
}

export function useUpdateStudy(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useStudyMutation(
    { teamId, studyId },
    (input: UpdateStudyInput) => updateStudy(teamId, studyId, input),
    // The source wordings changed: translations of them may be stale now.
    () => void qc.invalidateQueries({ queryKey: languageKeys.texts(teamId, studyId) }),
  );
}
