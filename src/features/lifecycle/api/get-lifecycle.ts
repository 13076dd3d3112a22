import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyLifecycle } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export function getLifecycle(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<StudyLifecycle>(lifecycleBase(teamId, studyId), signal);
}

export const getLifecycleQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: lifecycleKeys.state(teamId, studyId),
    queryFn: ({ signal }) => getLifecycle(teamId, studyId, signal),
  });

export function useLifecycle(teamId: string, studyId: string) {
  return useQuery(getLifecycleQueryOptions(teamId, studyId));
}
