import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
import { api } from '@/lib/api-client';
import { accountKeys } from './account-keys';

export const signOutSession = (sessionId: string) =>
  api.delete<void>(`/account/sessions/${sessionId}`);

/** Signs one of the user's sessions out (another device, usually). */
export function useSignOutSession() {
  return useRefreshingMutation(signOutSession, accountKeys.sessions());
}
