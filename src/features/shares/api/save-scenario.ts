import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { SavedScenario, ScenarioBodyInput } from '@shared/schemas/shares';
import { shareKeys, sharesPath } from './share-keys';

/** Saves a new scenario, or (with an id) replaces a saved one's name and contents. */
export function saveScenario(
  teamId: string,
  studyId: string,
  input: ScenarioBodyInput & { id?: string },
) {
  const { id, ...body } = input;
  const base = `${sharesPath(teamId, studyId)}/scenarios`;
  return id ? api.put<SavedScenario>(`${base}/${id}`, body) : api.post<SavedScenario>(base, body);
}

export function useSaveScenario(teamId: string, studyId: string) {
  return useRefreshingMutation(
    (input: ScenarioBodyInput & { id?: string }) => saveScenario(teamId, studyId, input),
    shareKeys.scenarios(teamId, studyId),
  );
}
