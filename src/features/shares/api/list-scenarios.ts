import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SavedScenario } from '@shared/schemas/shares';
import { shareKeys, sharesPath } from './share-keys';

/** The study's saved share scenarios, by name. */
export function listScenarios(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<SavedScenario[]>(`${sharesPath(teamId, studyId)}/scenarios`, signal);
}

export const listScenariosQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: shareKeys.scenarios(teamId, studyId),
    queryFn: ({ signal }) => listScenarios(teamId, studyId, signal),
  });

export function useScenarios(teamId: string, studyId: string) {
  return useQuery(listScenariosQueryOptions(teamId, studyId));
}
