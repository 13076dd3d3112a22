import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { StudyVersionSummary } from '@shared/schemas/study-lifecycle';
import { lifecycleBase, lifecycleKeys } from './lifecycle-keys';

export const getVersionsQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<StudyVersionSummary[]>(
    lifecycleKeys.versions(teamId, studyId),
    `${lifecycleBase(teamId, studyId)}/versions`,
  );

export function useVersions(teamId: string, studyId: string) {
  return useQuery(getVersionsQueryOptions(teamId, studyId));
}
