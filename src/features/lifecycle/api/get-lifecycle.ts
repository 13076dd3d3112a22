import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { StudyLifecycle } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export const getLifecycleQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<StudyLifecycle>(
    lifecycleKeys.state(teamId, studyId),
    lifecycleBase(teamId, studyId),
  );

export function useLifecycle(teamId: string, studyId: string) {
  return useQuery(getLifecycleQueryOptions(teamId, studyId));
}
