import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
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
  return useRefreshingMutation(
    (input: UpdateQualitySettingsInput) => updateQualitySettings(teamId, studyId, input),
    responseKeys.lists(teamId, studyId),
  );
}
