import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShareGroups } from '@shared/schemas/shares';
import { shareKeys, sharesPath, type ShareGroupsParams } from './share-keys';

/** Segments of the share model's respondents (a background answer, a task's choice, a class). */
export function getShareGroups(
  teamId: string,
  studyId: string,
  params: ShareGroupsParams,
  signal?: AbortSignal,
) {
  const q = new URLSearchParams({ runId: params.runId, groupBy: params.groupBy });
  if (params.task !== undefined) q.set('task', String(params.task));
  if (params.question !== undefined) q.set('question', params.question);
  return api.get<ShareGroups>(`${sharesPath(teamId, studyId)}/groups?${q}`, signal);
}

export function useShareGroups(teamId: string, studyId: string, params: ShareGroupsParams | null) {
  return useQuery(
    queryOptions({
      queryKey: shareKeys.groups(teamId, studyId, params ?? { runId: '', groupBy: 'task' }),
      queryFn: ({ signal }) => getShareGroups(teamId, studyId, params!, signal),
      staleTime: Infinity,
      enabled: params !== null,
    }),
  );
}
