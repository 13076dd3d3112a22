import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { DesignJobView } from '@shared/schemas/design-job';
import type { DesignSpecInput } from '@shared/schemas/design-spec';
import { designKeys } from './design-keys';

export function startDesignJob(teamId: string, studyId: string, spec: DesignSpecInput) {
  return api.post<DesignJobView>(`/teams/${teamId}/studies/${studyId}/design/jobs`, spec);
}

export function useStartDesignJob(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (spec: DesignSpecInput) => startDesignJob(teamId, studyId, spec),
    designKeys.state(teamId, studyId),
  );
}
