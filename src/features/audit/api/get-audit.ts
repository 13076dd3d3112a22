import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditPage, ListAuditQuery } from '@shared/schemas/audit';
import { auditKeys } from './audit-keys';

export type AuditFilters = Pick<ListAuditQuery, 'action' | 'actorId' | 'from' | 'to'>;

/** The query string of a set of filters (empty ones left out). */
export function auditQueryString(filters: AuditFilters, before?: number): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v) q.set(k, String(v));
  if (before) q.set('before', String(before));
  const s = q.toString();
  return s ? `?${s}` : '';
}

export const getAudit = (
  teamId: string,
  filters: AuditFilters,
  before?: number,
  signal?: AbortSignal,
) => api.get<AuditPage>(`/teams/${teamId}/audit${auditQueryString(filters, before)}`, signal);

export const getAuditQueryOptions = (teamId: string, filters: AuditFilters) =>
  infiniteQueryOptions({
    queryKey: auditKeys.list(teamId, filters),
    queryFn: ({ pageParam, signal }) => getAudit(teamId, filters, pageParam, signal),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });

export function useAudit(teamId: string, filters: AuditFilters) {
  return useInfiniteQuery(getAuditQueryOptions(teamId, filters));
}
