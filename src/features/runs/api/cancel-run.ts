import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Run } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

export function cancelRun(teamId: string, studyId: string, runId: string): Promise<Run> {
  return api.post<Run>(`${runsPath(teamId, studyId)}/${runId}/cancel`);
}

export function useCancelRun(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => cancelRun(teamId, studyId, runId),
    onSuccess: (run) => {
      qc.setQueryData(runKeys.detail(teamId, studyId, run.id), run);
      void qc.invalidateQueries({ queryKey: runKeys.lists(teamId, studyId) });
    },
  });
}
