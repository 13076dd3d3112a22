import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Segments } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath, toSearch, type SegmentsParams } from './taste-keys';

/** One coefficient's individual means split by a task choice, a background answer or a class. */
export function getSegments(
  teamId: string,
  studyId: string,
  params: SegmentsParams,
  signal?: AbortSignal,
) {
  return api.get<Segments>(`${tastesPath(teamId, studyId)}/segments?${toSearch(params)}`, signal);
}

export const getSegmentsQueryOptions = (teamId: string, studyId: string, params: SegmentsParams) =>
  queryOptions({
    queryKey: tasteKeys.segments(teamId, studyId, params),
    queryFn: ({ signal }) => getSegments(teamId, studyId, params, signal),
    placeholderData: keepPreviousData,
    enabled:
      params.runId !== '' &&
      params.coefficient !== '' &&
      (params.groupBy === 'class' ||
        (params.groupBy === 'task' ? params.task !== undefined : !!params.question)),
  });

export function useSegments(teamId: string, studyId: string, params: SegmentsParams) {
  return useQuery(getSegmentsQueryOptions(teamId, studyId, params));
}
