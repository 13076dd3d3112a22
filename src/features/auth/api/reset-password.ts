import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, ResetPasswordInput } from '@shared/schemas/auth';
import { useSessionChange } from '../hooks/use-session-change';

export const resetPassword = (input: ResetPasswordInput) =>
  api.post<CurrentUser>('/auth/reset-password', input);

/** Sets the new password; the server signs the user in with it. */
export function useResetPassword() {
  const changeSession = useSessionChange();
  return useMutation({ mutationFn: resetPassword, onSuccess: changeSession });
}
