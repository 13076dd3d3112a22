import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateInvitationInput, Invitation } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

type Params = CreateInvitationInput & { teamId: string };

export const createInvitation = ({ teamId, ...input }: Params) =>
  api.post<Invitation>(`/teams/${teamId}/invitations`, input);

export function useCreateInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: (_data, params) =>
      qc.invalidateQueries({ queryKey: teamKeys.invitations(params.teamId) }),
  });
}
