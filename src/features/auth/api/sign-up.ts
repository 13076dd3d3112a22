import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, SignUpInput } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const signUp = (input: SignUpInput) => api.post<CurrentUser>('/auth/sign-up', input);

/** Creates the account and its own team; the server signs the new user in. */
export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), me);
    },
  });
}
