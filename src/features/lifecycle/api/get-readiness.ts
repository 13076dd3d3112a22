import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Readiness } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export function getReadiness(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<Readiness>(`${lifecycleBase(teamId, studyId)}/readiness`, signal);
}

export const getReadinessQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: lifecycleKeys.readiness(teamId, studyId),
    queryFn: ({ signal }) => getReadiness(teamId, studyId, signal),
  });

export function useReadiness(teamId: string, studyId: string, enabled = true) {
  return useQuery({ ...getReadinessQueryOptions(teamId, studyId), enabled });
}
