import { queryOptions, type QueryKey } from '@tanstack/react-query';
import { api } from './api-client';

/**
 * The query options of one API read: GET `path` under `queryKey`, aborted with the query's
 * signal. Callers spread it into queryOptions to add polling or a stale time.
 */
export const apiQueryOptions = <T>(queryKey: QueryKey, path: string) =>
  queryOptions({ queryKey, queryFn: ({ signal }) => api.get<T>(path, signal) });
