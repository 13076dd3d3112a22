import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { searchString } from '@/lib/search-string';
import type { AuditPage, ListAuditQuery } from '@shared/schemas/audit';
import { auditKeys } from './audit-keys';

export type AuditFilters = Pick<ListAuditQuery, 'action' | 'actorId' | 'from' | 'to'>;

/** The query string of a set of filters (empty ones left out). */
export function auditQueryString(filters: AuditFilters, before?: number): string {
  return searchString({ ...filters, before: before || undefined });
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
