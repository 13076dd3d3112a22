import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { accountKeys } from './account-keys';

export const signOutSession = (sessionId: string) =>
  api.delete<void>(`/account/sessions/${sessionId}`);

/** Signs one of the user's sessions out (another device, usually). */
export function useSignOutSession() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOutSession,
    onSuccess: () => qc.invalidateQueries({ queryKey: accountKeys.sessions() }),
  });
}
