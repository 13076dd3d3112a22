/** Query keys of the languages feature, broad to narrow. */
export const languageKeys = {
  all: ['languages'] as const,
  texts: (teamId: string, studyId: string) => [...languageKeys.all, teamId, studyId] as const,
};

export const textsBase = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/texts`;
