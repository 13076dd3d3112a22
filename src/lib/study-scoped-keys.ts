/**
 * The two broadest query keys of a feature whose data belongs to one study: everything of the
 * feature (`all`), and everything of it in one team's study (`study`). The feature's narrower
 * keys extend `study`, so invalidating it refreshes all of the study's queries of the feature.
 */
export function studyScopedKeys<F extends string>(feature: F) {
  const all = [feature] as const;
  return {
    all,
    study: (teamId: string, studyId: string) => [...all, teamId, studyId] as const,
  };
}
