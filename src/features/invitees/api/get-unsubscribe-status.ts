import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UnsubscribeStatus } from '@shared/schemas/invitees';
import { inviteeKeys } from './invitee-keys';

export function getUnsubscribeStatus(token: string, signal?: AbortSignal) {
  return api.get<UnsubscribeStatus>(`/unsubscribe/${encodeURIComponent(token)}`, signal);
}

export const getUnsubscribeStatusQueryOptions = (token: string) =>
  queryOptions({
    queryKey: inviteeKeys.unsubscribe(token),
    queryFn: ({ signal }) => getUnsubscribeStatus(token, signal),
  });

export function useUnsubscribeStatus(token: string) {
  return useQuery(getUnsubscribeStatusQueryOptions(token));
}
