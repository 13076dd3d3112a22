/** What a study screen's panel is given: the study it shows, and whether the user may change it. */
export type StudyPanelProps = {
  teamId: string;
  studyId: string;
  canManage: boolean;
};
