import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LifecycleAction, StudyLifecycle } from '@shared/schemas/study-lifecycle';
import { studyKeys } from '@/features/studies/api/study-keys';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

/** Go live, close, reopen, or return a closed study to draft. */
export function changeStatus(teamId: string, studyId: string, action: LifecycleAction) {
  return api.post<StudyLifecycle>(`${lifecycleBase(teamId, studyId)}/${action}`);
}

export function useChangeStatus(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (action: LifecycleAction) => changeStatus(teamId, studyId, action),
    onSuccess: (state) => {
      qc.setQueryData(lifecycleKeys.state(teamId, studyId), state);
      void qc.invalidateQueries({ queryKey: lifecycleKeys.study(teamId, studyId) });
      // The study header, the questionnaire (editable or not) and fieldwork read the status.
      void qc.invalidateQueries({ queryKey: studyKeys.team(teamId) });
      void qc.invalidateQueries({ queryKey: ['questionnaire', teamId, studyId] });
    },
  });
}
