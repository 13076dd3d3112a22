import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UnsubscribeStatus } from '@shared/schemas/invitees';
import { inviteeKeys } from './invitee-keys';

export function unsubscribe(token: string): Promise<UnsubscribeStatus> {
  return api.post<UnsubscribeStatus>(`/unsubscribe/${encodeURIComponent(token)}`);
}

export function useUnsubscribe(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => unsubscribe(token),
    onSuccess: (status) => qc.setQueryData(inviteeKeys.unsubscribe(token), status),
  });
}
