import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type {
  QualitySettings,
  ResponsesSummary,
  UpdateQualitySettingsInput,
} from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export function updateQualitySettings(
  teamId: string,
  studyId: string,
  input: UpdateQualitySettingsInput,
): Promise<{ settings: QualitySettings; summary: ResponsesSummary }> {
  return api.put(`${responsesPath(teamId, studyId)}/quality-settings`, input);
}

export function useUpdateQualitySettings(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateQualitySettingsInput) =>
      updateQualitySettings(teamId, studyId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: responseKeys.lists(teamId, studyId) }),
  });
}
