import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { searchString } from '@/lib/search-string';
import type { InviteeList, ListInviteesQuery } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export function listInvitees(
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
  signal?: AbortSignal,
): Promise<InviteeList> {
  return api.get<InviteeList>(`${inviteesPath(teamId, studyId)}${searchString(query)}`, signal);
}

export const listInviteesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
) =>
  queryOptions({
    queryKey: inviteeKeys.list(teamId, studyId, query),
    queryFn: ({ signal }) => listInvitees(teamId, studyId, query, signal),
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
