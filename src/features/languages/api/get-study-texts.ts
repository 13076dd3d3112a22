import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { languageKeys, textsBase } from './language-keys';

export const getStudyTextsQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<StudyTextsView>(languageKeys.texts(teamId, studyId), textsBase(teamId, studyId));

export function useStudyTexts(teamId: string, studyId: string) {
  return useQuery(getStudyTextsQueryOptions(teamId, studyId));
}
