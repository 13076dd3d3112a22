/** Query keys of the studies feature, broad to narrow. */
export const studyKeys = {
  all: ['studies'] as const,
  team: (teamId: string) => [...studyKeys.all, teamId] as const,
  lists: (teamId: string) => [...studyKeys.team(teamId), 'list'] as const,
  list: (teamId: string, filters: { archived: boolean }) =>
    [...studyKeys.lists(teamId), filters] as const,
  detail: (teamId: string, studyId: string) =>
    [...studyKeys.team(teamId), 'detail', studyId] as const,
};
