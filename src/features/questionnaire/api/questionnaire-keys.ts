/** Query keys of the questionnaire feature, broad to narrow. */
export const questionnaireKeys = {
  all: ['questionnaire'] as const,
  detail: (teamId: string, studyId: string) => [...questionnaireKeys.all, teamId, studyId] as const,
};
