import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { languageKeys } from '@/features/languages/api/language-keys';
import type { Questionnaire } from '@shared/schemas/questionnaire';
import { questionnaireKeys } from './questionnaire-keys';
import type { QuestionnaireView } from './get-questionnaire';

export function saveQuestionnaire(teamId: string, studyId: string, questionnaire: Questionnaire) {
  return api.put<QuestionnaireView>(`/teams/${teamId}/studies/${studyId}/questionnaire`, {
    questionnaire,
  });
}

export function useSaveQuestionnaire(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (q: Questionnaire) => saveQuestionnaire(teamId, studyId, q),
    onSuccess: (view) => {
      qc.setQueryData(questionnaireKeys.detail(teamId, studyId), view);
      // Readiness to go live depends on the questionnaire.
      void qc.invalidateQueries({ queryKey: ['lifecycle', teamId, studyId] });
      // The source wordings changed: translations of them may be stale now.
      void qc.invalidateQueries({ queryKey: languageKeys.texts(teamId, studyId) });
    },
  });
}
