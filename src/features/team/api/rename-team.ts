import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { CreateTeamInput } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

type Params = CreateTeamInput & { teamId: string };

export const renameTeam = ({ teamId, ...input }: Params) =>
  api.patch<{ id: string; name: string }>(`/teams/${teamId}`, input);

export function useRenameTeam(
  options: { onSuccess?: (team: { id: string; name: string }) => void } = {},
) {
  return useRefreshingMutation(renameTeam, teamKeys.lists(), options.onSuccess);
}
