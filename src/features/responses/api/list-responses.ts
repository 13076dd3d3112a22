import { useQuery } from '@tanstack/react-query';
import { apiFilteredQueryOptions } from '@/lib/api-query-options';
import type { ListResponsesQuery, ResponseList } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export const listResponsesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListResponsesQuery>,
) =>
  apiFilteredQueryOptions<ResponseList>(
    responseKeys.list(teamId, studyId, query),
    responsesPath(teamId, studyId),
    query,
  );

export function useResponses(teamId: string, studyId: string, query: Partial<ListResponsesQuery>) {
  return useQuery(listResponsesQueryOptions(teamId, studyId, query));
}
