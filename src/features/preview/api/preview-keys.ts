/** Query keys of the preview feature. */
export const previewKeys = {
  all: ['preview'] as const,
  study: (teamId: string, studyId: string) => [...previewKeys.all, teamId, studyId] as const,
  respondent: (teamId: string, studyId: string, block: number, seed: number, lang = '') =>
    [...previewKeys.study(teamId, studyId), block, seed, lang] as const,
};
