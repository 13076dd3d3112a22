import { api } from '@/lib/api-client';
import type { Study } from '@shared/schemas/study';
import { useStudyMutation } from './use-study-mutation';

export function setStudyArchived(teamId: string, studyId: string, archived: boolean) {
  return api.put<Study>(`/teams/${teamId}/studies/${studyId}/archived`, { archived });
}

export function useSetStudyArchived(teamId: string) {
  return useStudyMutation({ teamId }, (v: { studyId: string; archived: boolean }) =>
    setStudyArchived(teamId, v.studyId, v.archived),
  );
}
