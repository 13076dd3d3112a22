import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

type Params = { teamId: string; userId: string };

export const removeMember = ({ teamId, userId }: Params) =>
  api.delete<void>(`/teams/${teamId}/members/${userId}`);

export function useRemoveMember(options: { onSuccess?: (p: Params) => void } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: async (_data, params) => {
      await qc.invalidateQueries({ queryKey: teamKeys.members(params.teamId) });
      options.onSuccess?.(params);
    },
  });
}
