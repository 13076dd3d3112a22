import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

export const acceptInvitation = (token: string) =>
  api.post<{ teamId: string }>(`/invitations/${encodeURIComponent(token)}/accept`);

export function useAcceptInvitation(options: { onSuccess?: (r: { teamId: string }) => void } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: async (result) => {
      await qc.invalidateQueries({ queryKey: teamKeys.lists() });
      options.onSuccess?.(result);
    },
  });
}
