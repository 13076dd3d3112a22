import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { ExcludeFlaggedInput } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export function excludeFlagged(
  teamId: string,
  studyId: string,
  input: ExcludeFlaggedInput,
): Promise<{ excluded: number }> {
  return api.post<{ excluded: number }>(`${responsesPath(teamId, studyId)}/exclude-flagged`, input);
}

export function useExcludeFlagged(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (input: ExcludeFlaggedInput) => excludeFlagged(teamId, studyId, input),
    responseKeys.lists(teamId, studyId),
  );
}
