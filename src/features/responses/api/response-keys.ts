import type { ListResponsesQuery } from '@shared/schemas/responses';
import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the responses feature, broad to narrow. */
export const responseKeys = {
  ...studyScopedKeys('responses'),
  lists: (teamId: string, studyId: string) =>
    [...responseKeys.study(teamId, studyId), 'list'] as const,
  list: (teamId: string, studyId: string, query: Partial<ListResponsesQuery>) =>
    [...responseKeys.lists(teamId, studyId), query] as const,
};

export const responsesPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/responses`;
