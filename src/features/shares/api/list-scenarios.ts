import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { SavedScenario } from '@shared/schemas/shares';
import { shareKeys, sharesPath } from './share-keys';

/** The study's saved share scenarios, by name. */
export const listScenariosQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<SavedScenario[]>(
    shareKeys.scenarios(teamId, studyId),
    `${sharesPath(teamId, studyId)}/scenarios`,
  );

export function useScenarios(teamId: string, studyId: string) {
  return useQuery(listScenariosQueryOptions(teamId, studyId));
}
