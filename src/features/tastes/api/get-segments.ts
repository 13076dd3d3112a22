import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFilteredQueryOptions } from '@/lib/api-query-options';
import type { Segments } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath, type SegmentsParams } from './taste-keys';

/** One coefficient's individual means split by a task choice, a background answer or a class. */
export const getSegmentsQueryOptions = (teamId: string, studyId: string, params: SegmentsParams) =>
  queryOptions({
    ...apiFilteredQueryOptions<Segments>(
      tasteKeys.segments(teamId, studyId, params),
      `${tastesPath(teamId, studyId)}/segments`,
      params,
    ),
    enabled:
      params.runId !== '' &&
      params.coefficient !== '' &&
      (params.groupBy === 'class' ||
        (params.groupBy === 'task' ? params.task !== undefined : !!params.question)),
  });

export function useSegments(teamId: string, studyId: string, params: SegmentsParams) {
  return useQuery(getSegmentsQueryOptions(teamId, studyId, params));
}
