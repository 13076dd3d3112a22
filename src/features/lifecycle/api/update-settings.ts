import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyLifecycle, UpdateFieldworkSettingsInput } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export function updateSettings(
  teamId: string,
  studyId: string,
  input: UpdateFieldworkSettingsInput,
) {
  return api.patch<StudyLifecycle>(`${lifecycleBase(teamId, studyId)}/settings`, input);
}

export function useUpdateSettings(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateFieldworkSettingsInput) => updateSettings(teamId, studyId, input),
    onSuccess: (state) => {
      qc.setQueryData(lifecycleKeys.state(teamId, studyId), state);
      void qc.invalidateQueries({ queryKey: lifecycleKeys.readiness(teamId, studyId) });
    },
  });
}
