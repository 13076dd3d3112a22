import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import type { StudyLifecycle } from '@shared/schemas/study-lifecycle';
import { lifecycleKeys } from './lifecycle-keys';

/**
 * A change to a study's lifecycle whose answer is the new lifecycle state: the state is put in
 * the cache at once, and the queries under `staleKeys`, which read it, are read again.
 */
export function useLifecycleMutation<TVariables>(
  teamId: string,
  studyId: string,
  mutationFn: (variables: TVariables) => Promise<StudyLifecycle>,
  staleKeys: readonly QueryKey[],
) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (state) => {
      qc.setQueryData(lifecycleKeys.state(teamId, studyId), state);
      for (const queryKey of staleKeys) void qc.invalidateQueries({ queryKey });
    },
  });
}
