import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TeamSummary } from '@shared/schemas/auth';
import type { CreateTeamInput } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

export const createTeam = (input: CreateTeamInput) => api.post<TeamSummary>('/teams', input);

export function useCreateTeam(options: { onSuccess?: (team: TeamSummary) => void } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createTeam,
    onSuccess: async (team) => {
      await qc.invalidateQueries({ queryKey: teamKeys.lists() });
      options.onSuccess?.(team);
    },
  });
}
