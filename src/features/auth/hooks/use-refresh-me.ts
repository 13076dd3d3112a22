import { useCallback } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { authKeys } from '../api/auth-keys';

/**
 * For route modules that change what the session shows (team list, roles, name) through
 * another feature's mutation: refetches the signed-in user.
 */
export function useRefreshMe(): () => Promise<void> {
  const qc = useQueryClient();
  return useCallback(() => qc.invalidateQueries({ queryKey: authKeys.me() }), [qc]);
}
