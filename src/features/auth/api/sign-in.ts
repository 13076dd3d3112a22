import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, SignInInput } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const signIn = (input: SignInInput) => api.post<CurrentUser>('/auth/sign-in', input);

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), me);
    },
  });
}
