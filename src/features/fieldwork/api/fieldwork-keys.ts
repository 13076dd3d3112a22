/** Query keys of the fieldwork feature, broad to narrow. */
export const fieldworkKeys = {
  all: ['fieldwork'] as const,
  stats: (teamId: string, studyId: string) => [...fieldworkKeys.all, teamId, studyId] as const,
};

export const fieldworkPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/fieldwork`;

/** While a study is live the figures refresh on their own. */
export const LIVE_REFRESH_MS = 10_000;
