import { useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { languageKeys } from '@/features/languages/api/language-keys';
import type { Study } from '@shared/schemas/study';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { useStudyMutation } from './use-study-mutation';

export type SavedDefinition = Study & { designDetached: boolean };

export function saveDefinition(teamId: string, studyId: string, definition: StudyDefinition) {
  return api.put<SavedDefinition>(`/teams/${teamId}/studies/${studyId}/definition`, {
    definition,
  });
}

/**
 * Saving may detach a design that no longer fits: the route passes `onSaved` to refresh
 * the design feature's queries (features do not import each other).
 */
export function useSaveDefinition(
  teamId: string,
  studyId: string,
  onSaved?: (study: SavedDefinition) => void,
) {
  const qc = useQueryClient();
  return useStudyMutation(
    { teamId, studyId },
    (definition: StudyDefinition) => saveDefinition(teamId, studyId, definition),
    (study) => {
      // The source wordings changed: translations of them may be stale now.
      void qc.invalidateQueries({ queryKey: languageKeys.texts(teamId, studyId) });
      onSaved?.(study);
    },
  );
}
