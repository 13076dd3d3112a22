import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShareModel } from '@shared/schemas/shares';
import { shareKeys, sharesPath } from './share-keys';

/** A finished run's share model: loaded once, then every scenario is computed in the browser. */
export function getShareModel(
  teamId: string,
  studyId: string,
  runId: string,
  signal?: AbortSignal,
) {
  const q = new URLSearchParams({ runId });
  return api.get<ShareModel>(`${sharesPath(teamId, studyId)}/model?${q}`, signal);
}

export const getShareModelQueryOptions = (teamId: string, studyId: string, runId: string) =>
  queryOptions({
    queryKey: shareKeys.model(teamId, studyId, runId),
    queryFn: ({ signal }) => getShareModel(teamId, studyId, runId, signal),
    // A finished run never changes (an erasure marks it, and reloading the page refetches).
    staleTime: Infinity,
    enabled: runId !== '',
  });

export function useShareModel(teamId: string, studyId: string, runId: string) {
  return useQuery(getShareModelQueryOptions(teamId, studyId, runId));
}
