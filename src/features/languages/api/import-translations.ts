import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type {
  ImportTranslationsInput,
  TranslationFormat,
  TranslationImportReport,
} from '@shared/schemas/study-texts';
import { lifecycleKeys } from '@/features/lifecycle/api/lifecycle-keys';
import { languageKeys, textsBase } from './language-keys';

/** Where a language's translator file downloads from (the API sends it as an attachment). */
export const translationFileHref = (
  teamId: string,
  studyId: string,
  lang: string,
  format: TranslationFormat,
) => `/api${textsBase(teamId, studyId)}/${encodeURIComponent(lang)}/file?format=${format}`;

export function importTranslations(
  teamId: string,
  studyId: string,
  lang: string,
  input: ImportTranslationsInput,
) {
  return api.post<TranslationImportReport>(
    `${textsBase(teamId, studyId)}/${encodeURIComponent(lang)}/file`,
    input,
  );
}

export function useImportTranslations(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { lang: string } & ImportTranslationsInput) =>
      importTranslations(teamId, studyId, input.lang, {
        format: input.format,
        content: input.content,
      }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: languageKeys.texts(teamId, studyId) });
      // Going live needs every text in every language.
      void qc.invalidateQueries({ queryKey: lifecycleKeys.study(teamId, studyId) });
    },
  });
}
