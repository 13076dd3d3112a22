import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export { studyKeys };

export const getStudyQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<Study>(studyKeys.detail(teamId, studyId), `/teams/${teamId}/studies/${studyId}`);

export function useStudy(teamId: string, studyId: string) {
  return useQuery(getStudyQueryOptions(teamId, studyId));
}
