import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import { searchString } from '@/lib/search-string';
import type { InviteeList, ListInviteesQuery } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export const listInviteesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
) =>
  queryOptions({
    ...apiQueryOptions<InviteeList>(
      inviteeKeys.list(teamId, studyId, query),
      `${inviteesPath(teamId, studyId)}${searchString(query)}`,
    ),
    placeholderData: keepPreviousData,
  });

export function useInvitees(
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
  enabled = true,
) {
  return useQuery({ ...listInviteesQueryOptions(teamId, studyId, query), enabled });
}
