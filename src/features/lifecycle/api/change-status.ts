import { api } from '@/lib/api-client';
import type { LifecycleAction, StudyLifecycle } from '@shared/schemas/study-lifecycle';
import { studyKeys } from '@/features/studies/api/study-keys';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';
import { useLifecycleMutation } from './use-lifecycle-mutation';

/** Go live, close, reopen, or return a closed study to draft. */
export function changeStatus(teamId: string, studyId: string, action: LifecycleAction) {
  return api.post<StudyLifecycle>(`${lifecycleBase(teamId, studyId)}/${action}`);
}

export function useChangeStatus(teamId: string, studyId: string) {
  return useLifecycleMutation(
    teamId,
    studyId,
    (action: LifecycleAction) => changeStatus(teamId, studyId, action),
    [
      lifecycleKeys.study(teamId, studyId),
      // The study header, the questionnaire (editable or not) and fieldwork read the status.
      studyKeys.team(teamId),
      ['questionnaire', teamId, studyId],
    ],
  );
}
