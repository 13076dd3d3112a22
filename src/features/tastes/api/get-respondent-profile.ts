import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RespondentProfile } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

/** One respondent's profile and their choices task by task. */
export function getRespondentProfile(
  teamId: string,
  studyId: string,
  runId: string,
  respondentId: string,
  signal?: AbortSignal,
) {
  return api.get<RespondentProfile>(
    `${tastesPath(teamId, studyId)}/runs/${runId}/respondents/${respondentId}`,
    signal,
  );
}

export const getRespondentProfileQueryOptions = (
  teamId: string,
  studyId: string,
  runId: string,
  respondentId: string,
) =>
  queryOptions({
    queryKey: tasteKeys.respondent(teamId, studyId, runId, respondentId),
    queryFn: ({ signal }) => getRespondentProfile(teamId, studyId, runId, respondentId, signal),
  });

export function useRespondentProfile(
  teamId: string,
  studyId: string,
  runId: string,
  respondentId: string,
) {
  return useQuery(getRespondentProfileQueryOptions(teamId, studyId, runId, respondentId));
}
