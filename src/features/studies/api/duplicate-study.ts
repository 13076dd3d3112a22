import { api } from '@/lib/api-client';
import type { Study } from '@shared/schemas/study';
import { useStudyMutation } from './use-study-mutation';

export function duplicateStudy(teamId: string, studyId: string): Promise<Study> {
  return api.post<Study>(`/teams/${teamId}/studies/${studyId}/duplicate`);
}

export function useDuplicateStudy(teamId: string) {
  return useStudyMutation({ teamId }, (studyId: string) => duplicateStudy(teamId, studyId));
}
