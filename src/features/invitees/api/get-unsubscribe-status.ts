import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { UnsubscribeStatus } from '@shared/schemas/invitees';
import { inviteeKeys } from './invitee-keys';

export const getUnsubscribeStatusQueryOptions = (token: string) =>
  apiQueryOptions<UnsubscribeStatus>(
    inviteeKeys.unsubscribe(token),
    `/unsubscribe/${encodeURIComponent(token)}`,
  );

export function useUnsubscribeStatus(token: string) {
  return useQuery(getUnsubscribeStatusQueryOptions(token));
}
