import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import { searchString } from '@/lib/search-string';
import type { ListResponsesQuery, ResponseList } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export const listResponsesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListResponsesQuery>,
) =>
  queryOptions({
    ...apiQueryOptions<ResponseList>(
      responseKeys.list(teamId, studyId, query),
      `${responsesPath(teamId, studyId)}${searchString(query)}`,
    ),
    placeholderData: keepPreviousData,
  });

export function useResponses(teamId: string, studyId: string, query: Partial<ListResponsesQuery>) {
  return useQuery(listResponsesQueryOptions(teamId, studyId, query));
}
