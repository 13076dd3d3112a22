import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { shareKeys, sharesPath } from './share-keys';

export function deleteScenario(teamId: string, studyId: string, id: string) {
  return api.delete<void>(`${sharesPath(teamId, studyId)}/scenarios/${id}`);
}

export function useDeleteScenario(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteScenario(teamId, studyId, id),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.scenarios(teamId, studyId) }),
  });
}
