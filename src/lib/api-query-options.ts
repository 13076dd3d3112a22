import { keepPreviousData, queryOptions, type QueryKey } from '@tanstack/react-query';
import { api } from './api-client';
import { searchString } from './search-string';

/**
 * The query options of one API read: GET `path` under `queryKey`, aborted with the query's
 * signal. Callers spread it into queryOptions to add polling or a stale time.
 */
export const apiQueryOptions = <T>(queryKey: QueryKey, path: string) =>
  queryOptions({ queryKey, queryFn: ({ signal }) => api.get<T>(path, signal) });

/**
 * The query options of a filtered read (a table page, a split, a comparison): GET `path` with
 * `params` as its query string, and the last answer kept on screen while the next one loads, so
 * a table does not blank out between pages or filters. Callers spread it to add `enabled`.
 */
export const apiFilteredQueryOptions = <T>(
  queryKey: QueryKey,
  path: string,
  params: Parameters<typeof searchString>[0],
) =>
  queryOptions({
    ...apiQueryOptions<T>(queryKey, `${path}${searchString(params)}`),
    placeholderData: keepPreviousData,
  });
