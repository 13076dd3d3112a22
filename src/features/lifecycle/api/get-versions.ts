import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyVersionSummary } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export function getVersions(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<StudyVersionSummary[]>(`${lifecycleBase(teamId, studyId)}/versions`, signal);
}

export const getVersionsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: lifecycleKeys.versions(teamId, studyId),
    queryFn: ({ signal }) => getVersions(teamId, studyId, signal),
  });

export function useVersions(teamId: string, studyId: string) {
  return useQuery(getVersionsQueryOptions(teamId, studyId));
}
