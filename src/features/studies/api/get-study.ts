import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Study } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export { studyKeys };

export function getStudy(teamId: string, studyId: string, signal?: AbortSignal): Promise<Study> {
  return api.get<Study>(`/teams/${teamId}/studies/${studyId}`, signal);
}

export const getStudyQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: studyKeys.detail(teamId, studyId),
    queryFn: ({ signal }) => getStudy(teamId, studyId, signal),
  });

export function useStudy(teamId: string, studyId: string) {
  return useQuery(getStudyQueryOptions(teamId, studyId));
}
