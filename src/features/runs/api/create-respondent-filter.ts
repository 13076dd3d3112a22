import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateRespondentFilterInput } from '@shared/schemas/run';
import { runKeys, runsPath } from './run-keys';

export function createRespondentFilter(
  teamId: string,
  studyId: string,
  input: CreateRespondentFilterInput,
): Promise<{ id: string; name: string }> {
  return api.post(`${runsPath(teamId, studyId)}/filters`, input);
}

export function useCreateRespondentFilter(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRespondentFilterInput) =>
      createRespondentFilter(teamId, studyId, input),
    onSuccess: () => void qc.invalidateQueries({ queryKey: runKeys.options(teamId, studyId) }),
  });
}
