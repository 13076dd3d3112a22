import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Questionnaire } from '@shared/schemas/questionnaire';
import { questionnaireKeys } from './questionnaire-keys';

export type QuestionnaireView = { questionnaire: Questionnaire; saved: boolean; editable: boolean };

export const getQuestionnaireQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<QuestionnaireView>(
    questionnaireKeys.detail(teamId, studyId),
    `/teams/${teamId}/studies/${studyId}/questionnaire`,
  );

export function useQuestionnaire(teamId: string, studyId: string) {
  return useQuery(getQuestionnaireQueryOptions(teamId, studyId));
}
