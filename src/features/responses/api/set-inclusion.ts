import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { SetInclusionInput } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export type InclusionResult = { id: string; included: boolean; exclusionReason: string | null };

/** Include or exclude one respondent from estimation (a reason is required to exclude). */
export function setInclusion(
  teamId: string,
  studyId: string,
  respondentId: string,
  input: SetInclusionInput,
): Promise<InclusionResult> {
  return api.put<InclusionResult>(
    `${responsesPath(teamId, studyId)}/${respondentId}/inclusion`,
    input,
  );
}

export function useSetInclusion(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (v: { respondentId: string; input: SetInclusionInput }) =>
      setInclusion(teamId, studyId, v.respondentId, v.input),
    responseKeys.lists(teamId, studyId),
  );
}
