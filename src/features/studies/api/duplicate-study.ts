import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export function duplicateStudy(teamId: string, studyId: string): Promise<Study> {
  return api.post<Study>(`/teams/${teamId}/studies/${studyId}/duplicate`);
}

export function useDuplicateStudy(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (studyId: string) => duplicateStudy(teamId, studyId),
    onSuccess: (study) => {
      qc.setQueryData(studyKeys.detail(teamId, study.id), study);
      void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
