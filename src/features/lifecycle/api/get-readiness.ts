import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { Readiness } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export const getReadinessQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<Readiness>(
    lifecycleKeys.readiness(teamId, studyId),
    `${lifecycleBase(teamId, studyId)}/readiness`,
  );

export function useReadiness(teamId: string, studyId: string, enabled = true) {
  return useQuery({ ...getReadinessQueryOptions(teamId, studyId), enabled });
}
