import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import type { TeamSummary } from '@shared/schemas/auth';
import type { CreateTeamInput } from '@shared/schemas/team';
import { teamKeys } from './team-keys';

export const createTeam = (input: CreateTeamInput) => api.post<TeamSummary>('/teams', input);

export function useCreateTeam(options: { onSuccess?: (team: TeamSummary) => void } = {}) {
  return useRefreshingMutation(createTeam, teamKeys.lists(), options.onSuccess);
}
