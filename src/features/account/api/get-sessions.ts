import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { AccountSession } from '@shared/schemas/auth';
import { accountKeys } from './account-keys';

export const getSessionsQueryOptions = () =>
  apiQueryOptions<AccountSession[]>(accountKeys.sessions(), '/account/sessions');

export function useSessions() {
  return useQuery(getSessionsQueryOptions());
}
