import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ListResponsesQuery, ResponseList } from '@shared/schemas/responses';
import { responseKeys, responsesPath } from './response-keys';

export function listResponses(
  teamId: string,
  studyId: string,
  query: Partial<ListResponsesQuery>,
  signal?: AbortSignal,
): Promise<ResponseList> {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined) params.set(k, String(v));
  const qs = params.toString();
  return api.get<ResponseList>(`${responsesPath(teamId, studyId)}${qs ? `?${qs}` : ''}`, signal);
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
