import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

/**
 * A mutation that answers with a study: the answer becomes the cached detail of the study (the
 * given `studyId`, or for a new or picked study the answer's id) and the team's study lists are
 * read again; `then` runs after, for whatever else the change touches.
 */
export function useStudyMutation<TVariables, TStudy extends Study = Study>(
  { teamId, studyId }: { teamId: string; studyId?: string },
  mutationFn: (variables: TVariables) => Promise<TStudy>,
  then?: (study: TStudy) => void,
) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (study) => {
      qc.setQueryData(studyKeys.detail(teamId, studyId ?? study.id), study);
      void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
      then?.(study);
    },
  });
}
