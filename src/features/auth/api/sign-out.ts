import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { authKeys } from './auth-keys';

export const signOut = () => api.post<void>('/auth/sign-out');

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
