import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Questionnaire } from '@shared/schemas/questionnaire';
import { questionnaireKeys } from './questionnaire-keys';

export type QuestionnaireView = { questionnaire: Questionnaire; saved: boolean; editable: boolean };

export function getQuestionnaire(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<QuestionnaireView>(`/teams/${teamId}/studies/${studyId}/questionnaire`, signal);
}

export const getQuestionnaireQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: questionnaireKeys.detail(teamId, studyId),
    queryFn: ({ signal }) => getQuestionnaire(teamId, studyId, signal),
  });

export function useQuestionnaire(teamId: string, studyId: string) {
  return useQuery(getQuestionnaireQueryOptions(teamId, studyId));
}
