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

  it('takes the key from the variables and calls onRefreshed once the queries are invalidated', async () => {
    const qc = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
    qc.setQueryData(['team', 't1'], 'a');
    qc.setQueryData(['team', 't2'], 'b');
    const wrapper = ({ children }: { children: ReactNode }) => (
      <QueryClientProvider client={qc}>{children}</QueryClientProvider>
    );
    const calls: [string, string, boolean | undefined][] = [];
    const { result } = renderHook(
      () =>
        useRefreshingMutation(
          async (teamId: string) => `done ${teamId}`,
          (teamId) => ['team', teamId],
          (data, teamId) =>
            calls.push([data, teamId, qc.getQueryState(['team', teamId])?.isInvalidated]),
        ),
      { wrapper },
    );
    await act(async () => {
      await result.current.mutateAsync('t1');
    });
    expect(calls).toEqual([['done t1', 't1', true]]);
    expect(qc.getQueryState(['team', 't2'])?.isInvalidated).toBe(false);
  });
});
