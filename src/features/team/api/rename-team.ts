import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateTeamInput } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

type Params = CreateTeamInput & { teamId: string };

export const renameTeam = ({ teamId, ...input }: Params) =>
  api.patch<{ id: string; name: string }>(`/teams/${teamId}`, input);

export function useRenameTeam(
  options: { onSuccess?: (team: { id: string; name: string }) => void } = {},
) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: renameTeam,
    onSuccess: async (team) => {
      await qc.invalidateQueries({ queryKey: teamKeys.lists() });
      options.onSuccess?.(team);
    },
  });
}
