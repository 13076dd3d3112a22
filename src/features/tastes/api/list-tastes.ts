import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TasteList } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath, toSearch } from './taste-keys';

export type TastesQuery = {
  runId: string;
  page: number;
  pageSize: number;
  sort: string;
  dir: 'asc' | 'desc';
  lowDraws?: boolean;
  flagged?: boolean;
  question?: string;
  answer?: string;
};

/** One page of the profile table, sorted and filtered on the server. */
export function listTastes(teamId: string, studyId: string, q: TastesQuery, signal?: AbortSignal) {
  return api.get<TasteList>(`${tastesPath(teamId, studyId)}?${toSearch(q)}`, signal);
}

export const listTastesQueryOptions = (teamId: string, studyId: string, q: TastesQuery) =>
  queryOptions({
    queryKey: tasteKeys.list(teamId, studyId, q),
    queryFn: ({ signal }) => listTastes(teamId, studyId, q, signal),
    placeholderData: keepPreviousData,
    enabled: q.runId !== '',
  });

export function useTastes(teamId: string, studyId: string, q: TastesQuery) {
  return useQuery(listTastesQueryOptions(teamId, studyId, q));
}
