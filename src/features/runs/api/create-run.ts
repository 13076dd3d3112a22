import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateRunInput, Run } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

export function createRun(teamId: string, studyId: string, input: CreateRunInput): Promise<Run> {
  return api.post<Run>(runsPath(teamId, studyId), input);
}

export function useCreateRun(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRunInput) => createRun(teamId, studyId, input),
    onSuccess: (run) => {
      qc.setQueryData(runKeys.detail(teamId, studyId, run.id), run);
      qc.setQueryData<Run[]>(runKeys.lists(teamId, studyId), (old) => [run, ...(old ?? [])]);
      void qc.invalidateQueries({ queryKey: runKeys.lists(teamId, studyId) });
      void qc.invalidateQueries({ queryKey: runKeys.options(teamId, studyId) });
    },
  });
}
