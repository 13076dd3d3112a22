import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { DesignJobView } from '@shared/schemas/design-job';
import type { DesignSpecInput } from '@shared/schemas/design-spec';
import { designKeys } from './design-keys';

/** Generates a design beside the current one, to compare and then adopt or discard. */
export function startCandidateJob(teamId: string, studyId: string, spec: DesignSpecInput) {
  return api.post<DesignJobView>(`/teams/${teamId}/studies/${studyId}/design/candidates`, spec);
}

export function useStartCandidateJob(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (spec: DesignSpecInput) => startCandidateJob(teamId, studyId, spec),
    designKeys.state(teamId, studyId),
  );
}
