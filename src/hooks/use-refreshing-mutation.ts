import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';

/**
 * A mutation after which the queries under `queryKey` (or the key of the variables it was
 * called with) are read again, and then `onRefreshed` runs. The invalidation is awaited in
 * `onSuccess`, so `mutateAsync` resolves, and `onRefreshed` sees the fresh data, only once it is in.
 */
export function useRefreshingMutation<TData, TVariables = void>(
  mutationFn: (variables: TVariables) => Promise<TData>,
  queryKey: QueryKey | ((variables: TVariables) => QueryKey),
  onRefreshed?: (data: TData, variables: TVariables) => void,
) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async (data, variables) => {
      const key = typeof queryKey === 'function' ? queryKey(variables) : queryKey;
      await qc.invalidateQueries({ queryKey: key });
      onRefreshed?.(data, variables);
    },
  });
}
