import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AccountSession } from '@shared/schemas/auth';
import { accountKeys } from './account-keys';

export const getSessions = (signal?: AbortSignal) =>
  api.get<AccountSession[]>('/account/sessions', signal);

export const getSessionsQueryOptions = () =>
  queryOptions({ queryKey: accountKeys.sessions(), queryFn: ({ signal }) => getSessions(signal) });

export function useSessions() {
  return useQuery(getSessionsQueryOptions());
}
