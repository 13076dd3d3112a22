import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { CurrentUser } from '@shared/schemas/auth';
import { authKeys } from './auth-keys';

/** The signed-in user, or null when nobody is signed in. */
export async function getMe(signal?: AbortSignal): Promise<CurrentUser | null> {
  try {
    return await api.get<CurrentUser>('/auth/me', signal);
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(getMeQueryOptions());
}
