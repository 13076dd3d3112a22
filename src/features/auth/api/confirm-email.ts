import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ConfirmEmailInput, CurrentUser } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

export const confirmEmail = (input: ConfirmEmailInput) =>
  api.post<CurrentUser>('/auth/confirm-email', input);

/** Confirms the address from the e-mailed link; the server signs the user in. */
export function useConfirmEmail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: confirmEmail,
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), me);
    },
  });
}
