import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/permissions';
import { teamKeys } from './team-keys';

type Params = { teamId: string; userId: string; role: Role };

export const changeMemberRole = ({ teamId, userId, role }: Params) =>
  api.patch<{ teamId: string; userId: string; role: Role }>(`/teams/${teamId}/members/${userId}`, {
    role,
  });

export function useChangeMemberRole(options: { onSuccess?: (p: Params) => void } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: changeMemberRole,
    onSuccess: async (_data, params) => {
      await qc.invalidateQueries({ queryKey: teamKeys.members(params.teamId) });
      options.onSuccess?.(params);
    },
  });
}
