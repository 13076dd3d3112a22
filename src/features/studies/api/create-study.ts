import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateStudyInput, Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export function createStudy(teamId: string, input: CreateStudyInput): Promise<Study> {
  return api.post<Study>(`/teams/${teamId}/studies`, input);
}

export function useCreateStudy(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateStudyInput) => createStudy(teamId, input),
    onSuccess: (study) => {
      qc.setQueryData(studyKeys.detail(teamId, study.id), study);
      void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
