import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFilteredQueryOptions } from '@/lib/api-query-options';
import type { TasteList } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

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
export const listTastesQueryOptions = (teamId: string, studyId: string, q: TastesQuery) =>
  queryOptions({
    ...apiFilteredQueryOptions<TasteList>(
      tasteKeys.list(teamId, studyId, q),
      tastesPath(teamId, studyId),
      q,
    ),
    enabled: q.runId !== '',
  });

export function useTastes(teamId: string, studyId: string, q: TastesQuery) {
  return useQuery(listTastesQueryOptions(teamId, studyId, q));
}
