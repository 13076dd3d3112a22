import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';

/**
 * A mutation after which the queries under `queryKey` are read again. The invalidation is
 * returned from `onSuccess`, so `mutateAsync` resolves only once the fresh data is in.
 */
export function useRefreshingMutation<TData, TVariables = void>(
  mutationFn: (variables: TVariables) => Promise<TData>,
  queryKey: QueryKey,
) {
  const qc = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => qc.invalidateQueries({ queryKey }) });
}
