import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const signOutEverywhere = () => api.post<void>('/account/sessions/sign-out-everywhere');

/** Ends every session of the user, this browser's too; everything cached goes with it. */
export function useSignOutEverywhere() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signOutEverywhere, onSuccess: () => qc.clear() });
}
