import { useQuery } from '@tanstack/react-query';
import { apiFilteredQueryOptions } from '@/lib/api-query-options';
import type { InviteeList, ListInviteesQuery } from '@shared/schemas/invitees';
import { inviteeKeys, inviteesPath } from './invitee-keys';

export const listInviteesQueryOptions = (
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
) =>
  apiFilteredQueryOptions<InviteeList>(
    inviteeKeys.list(teamId, studyId, query),
    inviteesPath(teamId, studyId),
    query,
  );

export function useInvitees(
  teamId: string,
  studyId: string,
  query: Partial<ListInviteesQuery>,
  enabled = true,
) {
  return useQuery({ ...listInviteesQueryOptions(teamId, studyId, query), enabled });
}
