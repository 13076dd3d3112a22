import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { searchString } from '@/lib/search-string';
import type { ListResponsesQuery, ResponseList } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export function listResponses(
  teamId: string,
  studyId: string,
  query: Partial<ListResponsesQuery>,
  signal?: AbortSignal,
): Promise<ResponseList> {
  return api.get<ResponseList>(`${responsesPath(teamId, studyId)}${searchString(query)}`, signal);
}

export const listResponsesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListResponsesQuery>,
) =>
  queryOptions({
    queryKey: responseKeys.list(teamId, studyId, query),
    queryFn: ({ signal }) => listResponses(teamId, studyId, query, signal),
    placeholderData: keepPreviousData,
  });

export function useResponses(teamId: string, studyId: string, query: Partial<ListResponsesQuery>) {
  return useQuery(listResponsesQueryOptions(teamId, studyId, query));
}
