import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { StudySummary } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export const listStudiesQueryOptions = (teamId: string, filters: { archived: boolean }) =>
  apiQueryOptions<StudySummary[]>(
    studyKeys.list(teamId, filters),
    `/teams/${teamId}/studies?archived=${filters.archived ? 'true' : 'false'}`,
  );

export function useStudies(teamId: string, filters: { archived: boolean }) {
  return useQuery(listStudiesQueryOptions(teamId, filters));
}
