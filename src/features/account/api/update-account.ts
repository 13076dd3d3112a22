import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, UpdateAccountInput } from '@shared/schemas/auth';

export const updateAccount = (input: UpdateAccountInput) =>
  api.patch<CurrentUser>('/account', input);

/** The account's data lives in the session query; the caller refreshes it (see useRefreshMe). */
export function useUpdateAccount(options: { onSuccess?: (me: CurrentUser) => void } = {}) {
  return useMutation({ mutationFn: updateAccount, onSuccess: options.onSuccess });
}
