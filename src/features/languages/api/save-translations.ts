import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { lifecycleKeys } from '@/features/lifecycle/api/lifecycle-keys';
import { languageKeys, textsBase } from './language-keys';

export function saveTranslations(
  teamId: string,
  studyId: string,
  lang: string,
  texts: Record<string, string>,
) {
  return api.put<StudyTextsView>(`${textsBase(teamId, studyId)}/${encodeURIComponent(lang)}`, {
    texts,
  });
}

export function useSaveTranslations(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { lang: string; texts: Record<string, string> }) =>
      saveTranslations(teamId, studyId, input.lang, input.texts),
    onSuccess: (view) => {
      qc.setQueryData(languageKeys.texts(teamId, studyId), view);
      void qc.invalidateQueries({ queryKey: lifecycleKeys.study(teamId, studyId) });
    },
  });
}
