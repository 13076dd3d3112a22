import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudySummary } from '@shared/schemas/study';
import { studyKeys } from './study-keys';

export function listStudies(
  teamId: string,
  filters: { archived: boolean },
  signal?: AbortSignal,
): Promise<StudySummary[]> {
  return api.get<StudySummary[]>(
    `/teams/${teamId}/studies?archived=${filters.archived ? 'true' : 'false'}`,
    signal,
  );
}

export const listStudiesQueryOptions = (teamId: string, filters: { archived: boolean }) =>
  queryOptions({
    queryKey: studyKeys.list(teamId, filters),
    queryFn: ({ signal }) => listStudies(teamId, filters, signal),
  });

export function useStudies(teamId: string, filters: { archived: boolean }) {
  return useQuery(listStudiesQueryOptions(teamId, filters));
}
