import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { shareKeys, sharesPath } from './share-keys';

export function deleteScenario(teamId: string, studyId: string, id: string) {
  return api.delete<void>(`${sharesPath(teamId, studyId)}/scenarios/${id}`);
}

export function useDeleteScenario(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (id: string) => deleteScenario(teamId, studyId, id),
    shareKeys.scenarios(teamId, studyId),
  );
}
