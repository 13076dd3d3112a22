import { useQueryClient } from '@tanstack/react-query';
import type { CurrentUser } from '@shared/schemas/auth';
import { authKeys } from '../api/auth-keys';

/**
 * What a sign-in, sign-out or a server-side sign-in (confirmed e-mail, reset password) does to
 * the cache: everything read as the previous user is dropped, and the new user (or nobody) is
 * set, so no screen shows one account's data to the next.
 */
export function useSessionChange(): (me: CurrentUser | null) => void {
  const qc = useQueryClient();
  return (me) => {
    qc.clear();
    qc.setQueryData(authKeys.me(), me);
  };
}
