import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

type Params = { teamId: string; userId: string };

export const removeMember = ({ teamId, userId }: Params) =>
  api.delete<void>(`/teams/${teamId}/members/${userId}`);

export function useRemoveMember(options: { onSuccess?: (p: Params) => void } = {}) {
  return useRefreshingMutation(
    removeMember,
    (params) => teamKeys.members(params.teamId),
    (_data, params) => options.onSuccess?.(params),
  );
}
