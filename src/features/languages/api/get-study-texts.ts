import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { languageKeys, textsBase } from './language-keys';

export function getStudyTexts(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<StudyTextsView>(textsBase(teamId, studyId), signal);
}

export const getStudyTextsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: languageKeys.texts(teamId, studyId),
    queryFn: ({ signal }) => getStudyTexts(teamId, studyId, signal),
  });

export function useStudyTexts(teamId: string, studyId: string) {
  return useQuery(getStudyTextsQueryOptions(teamId, studyId));
}
