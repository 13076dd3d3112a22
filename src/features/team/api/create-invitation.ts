import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { CreateInvitationInput, Invitation } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

type Params = CreateInvitationInput & { teamId: string };

export const createInvitation = ({ teamId, ...input }: Params) =>
  api.post<Invitation>(`/teams/${teamId}/invitations`, input);

export function useCreateInvitation() {
  return useRefreshingMutation(createInvitation, (params) => teamKeys.invitations(params.teamId));
}
