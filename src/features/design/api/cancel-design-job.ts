import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DesignJobView } from '@shared/schemas/design-job';
import { designKeys } from './design-keys';

export function cancelDesignJob(teamId: string, studyId: string, jobId: string) {
  return api.post<DesignJobView>(`/teams/${teamId}/studies/${studyId}/design/jobs/${jobId}/cancel`);
}

export function useCancelDesignJob(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (jobId: string) => cancelDesignJob(teamId, studyId, jobId),
    onSettled: () => qc.invalidateQueries({ queryKey: designKeys.state(teamId, studyId) }),
  });
}
