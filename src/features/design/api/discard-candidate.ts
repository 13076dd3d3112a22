import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { designKeys } from './design-keys';

/** Keeps the current design: the candidate is deleted. */
export function discardCandidate(teamId: string, studyId: string, designId: string) {
  return api.delete<void>(`/teams/${teamId}/studies/${studyId}/design/candidates/${designId}`);
}

export function useDiscardCandidate(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (designId: string) => discardCandidate(teamId, studyId, designId),
    designKeys.state(teamId, studyId),
  );
}
