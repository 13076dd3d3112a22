import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { RespondentProfile } from '@shared/schemas/tastes';
import { tasteKeys, tastesPath } from './taste-keys';

/** One respondent's profile and their choices task by task. */
export const getRespondentProfileQueryOptions = (
  teamId: string,
  studyId: string,
  runId: string,
  respondentId: string,
) =>
  apiQueryOptions<RespondentProfile>(
    tasteKeys.respondent(teamId, studyId, runId, respondentId),
    `${tastesPath(teamId, studyId)}/runs/${runId}/respondents/${respondentId}`,
  );

export function useRespondentProfile(
  teamId: string,
  studyId: string,
  runId: string,
  respondentId: string,
) {
  return useQuery(getRespondentProfileQueryOptions(teamId, studyId, runId, respondentId));
}
