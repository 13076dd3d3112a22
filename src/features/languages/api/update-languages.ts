import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { lifecycleKeys } from '@/features/lifecycle/api/lifecycle-keys';
import { languageKeys, textsBase } from './language-keys';

export function updateLanguages(teamId: string, studyId: string, languages: string[]) {
  return api.put<StudyTextsView>(`${textsBase(teamId, studyId)}/languages`, { languages });
}

export function useUpdateLanguages(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (languages: string[]) => updateLanguages(teamId, studyId, languages),
    onSuccess: (view) => {
      qc.setQueryData(languageKeys.texts(teamId, studyId), view);
      // Going live needs every text in every language.
      void qc.invalidateQueries({ queryKey: lifecycleKeys.study(teamId, studyId) });
    },
  });
}
