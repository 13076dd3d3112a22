import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type AdoptResult = { designId: string; version: number | null; status: string };

/** Makes the candidate the study's design (a new frozen version when the study is live). */
export function adoptCandidate(teamId: string, studyId: string, designId: string) {
  return api.post<AdoptResult>(
    `/teams/${teamId}/studies/${studyId}/design/candidates/${designId}/adopt`,
  );
}

export function useAdoptCandidate(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (designId: string) => adoptCandidate(teamId, studyId, designId),
    // The study's version and status change too.
    onSuccess: () => qc.invalidateQueries(),
  });
}
