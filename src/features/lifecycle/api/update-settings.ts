import { api } from '@/lib/api-client';
import type { StudyLifecycle, UpdateFieldworkSettingsInput } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';
import { useLifecycleMutation } from './use-lifecycle-mutation';

export function updateSettings(
  teamId: string,
  studyId: string,
  input: UpdateFieldworkSettingsInput,
) {
  return api.patch<StudyLifecycle>(`${lifecycleBase(teamId, studyId)}/settings`, input);
}

export function useUpdateSettings(teamId: string, studyId: string) {
  return useLifecycleMutation(
    teamId,
    studyId,
    (input: UpdateFieldworkSettingsInput) => updateSettings(teamId, studyId, input),
    [lifecycleKeys.readiness(teamId, studyId)],
  );
}
