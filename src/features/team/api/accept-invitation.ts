import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

export const acceptInvitation = (token: string) =>
  api.post<{ teamId: string }>(`/invitations/${encodeURIComponent(token)}/accept`);

export function useAcceptInvitation(options: { onSuccess?: (r: { teamId: string }) => void } = {}) {
  return useRefreshingMutation(acceptInvitation, teamKeys.lists(), options.onSuccess);
}
