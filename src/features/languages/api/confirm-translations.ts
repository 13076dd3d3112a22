import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { lifecycleKeys } from '@/features/lifecycle/api/lifecycle-keys';
import { languageKeys, textsBase } from './language-keys';

/** Marks translations whose source wording changed as checked and still right. */
export function confirmTranslations(teamId: string, studyId: string, lang: string, keys: string[]) {
  return api.put<StudyTextsView>(
    `${textsBase(teamId, studyId)}/${encodeURIComponent(lang)}/confirmed`,
    { keys },
  );
}

export function useConfirmTranslations(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { lang: string; keys: string[] }) =>
      confirmTranslations(teamId, studyId, input.lang, input.keys),
    onSuccess: (view) => {
      qc.setQueryData(languageKeys.texts(teamId, studyId), view);
      // The go-live check lists stale translations as a warning.
      void qc.invalidateQueries({ queryKey: lifecycleKeys.study(teamId, studyId) });
    },
  });
}
