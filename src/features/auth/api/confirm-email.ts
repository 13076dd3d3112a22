import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ConfirmEmailInput, CurrentUser } from '@shared/schemas/auth';
import { useSessionChange } from '../hooks/use-session-change';

export const confirmEmail = (input: ConfirmEmailInput) =>
  api.post<CurrentUser>('/auth/confirm-email', input);

/** Confirms the address from the e-mailed link; the server signs the user in. */
export function useConfirmEmail() {
  const changeSession = useSessionChange();
  return useMutation({ mutationFn: confirmEmail, onSuccess: changeSession });
}
