import type { ListInviteesQuery } from '@shared/schemas/invitees';
import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the invitees feature, broad to narrow. */
export const inviteeKeys = {
  ...studyScopedKeys('invitees'),
  lists: (teamId: string, studyId: string) =>
    [...inviteeKeys.study(teamId, studyId), 'list'] as const,
  list: (teamId: string, studyId: string, query: Partial<ListInviteesQuery>) =>
    [...inviteeKeys.lists(teamId, studyId), query] as const,
  unsubscribe: (token: string) => [...inviteeKeys.all, 'unsubscribe', token] as const,
};

export const inviteesPath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/invitees`;
