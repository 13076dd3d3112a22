// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import type { ReactNode } from 'react';
import { renderHook } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useSessionChange } from '@/features/auth/hooks/use-session-change';
import { authKeys } from '@/features/auth/api/auth-keys';
import type { CurrentUser } from '@shared/schemas/auth';

function setup() {
  const qc = new QueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={qc}>{children}</QueryClientProvider>
  );
  const { result } = renderHook(() => useSessionChange(), { wrapper });
  return { qc, changeSession: result.current };
}

describe('useSessionChange', () => {
  it('drops what was read as the previous user and sets the new one', () => {
    const { qc, changeSession } = setup();
    qc.setQueryData(['studies', 'team-a'], ['Water service packages']);
    const me = { id: 'u2', email: 'b@example.org' } as unknown as CurrentUser;
    changeSession(me);
    expect(qc.getQueryData(['studies', 'team-a'])).toBeUndefined();
    expect(qc.getQueryData(authKeys.me())).toEqual(me);
  });

  it('on sign-out leaves nobody signed in', () => {
    const { qc, changeSession } = setup();
    qc.setQueryData(authKeys.me(), { id: 'u1' });
    changeSession(null);
    expect(qc.getQueryData(authKeys.me())).toBeNull();
  });
});
