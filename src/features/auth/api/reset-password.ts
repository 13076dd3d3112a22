import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, ResetPasswordInput } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const resetPassword = (input: ResetPasswordInput) =>
  api.post<CurrentUser>('/auth/reset-password', input);

/** Sets the new password; the server signs the user in with it. */
export function useResetPassword() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), me);
    },
  });
}
