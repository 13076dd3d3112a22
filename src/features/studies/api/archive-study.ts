import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export function setStudyArchived(teamId: string, studyId: string, archived: boolean) {
  return api.put<Study>(`/teams/${teamId}/studies/${studyId}/archived`, { archived });
}

export function useSetStudyArchived(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { studyId: string; archived: boolean }) =>
      setStudyArchived(teamId, v.studyId, v.archived),
    onSuccess: (study) => {
      qc.setQueryData(studyKeys.detail(teamId, study.id), study);
      void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
