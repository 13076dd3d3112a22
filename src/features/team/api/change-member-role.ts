import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/permissions';
import { teamKeys } from './team-keys';

type Params = { teamId: string; userId: string; role: Role };

export const changeMemberRole = ({ teamId, userId, role }: Params) =>
  api.patch<{ teamId: string; userId: string; role: Role }>(`/teams/${teamId}/members/${userId}`, {
    role,
  });

export function useChangeMemberRole(options: { onSuccess?: (p: Params) => void } = {}) {
  return useRefreshingMutation(
    changeMemberRole,
    (params) => teamKeys.members(params.teamId),
    (_data, params) => options.onSuccess?.(params),
  );
}
