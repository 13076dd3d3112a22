// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import type { ReactNode } from 'react';
import { act, renderHook } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';

function setup(mutationFn: (n: number) => Promise<number>) {
  const qc = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  qc.setQueryData(['things', 'list'], [1]);
  qc.setQueryData(['other'], 'kept');
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={qc}>{children}</QueryClientProvider>
  );
  const { result } = renderHook(() => useRefreshingMutation(mutationFn, ['things']), { wrapper });
  return { qc, result };
}

describe('useRefreshingMutation', () => {
  it('after a success marks the queries under its key stale, and only those', async () => {
    const { qc, result } = setup(async (n) => n * 2);
    let value: number | undefined;
    await act(async () => {
      value = await result.current.mutateAsync(21);
    });
    expect(value).toBe(42);
    expect(qc.getQueryState(['things', 'list'])?.isInvalidated).toBe(true);
    expect(qc.getQueryState(['other'])?.isInvalidated).toBe(false);
  });

  it('after a failure leaves the cache as it was', async () => {
    const { qc, result } = setup(async () => {
      throw new Error('refused');
    });
    await act(async () => {
      await expect(result.current.mutateAsync(1)).rejects.toThrow('refused');
    });
    expect(qc.getQueryState(['things', 'list'])?.isInvalidated).toBe(false);
  });
});
