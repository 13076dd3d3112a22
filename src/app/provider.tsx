import { useState, type ReactNode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { setUnauthenticatedHandler } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

export function AppProvider({
  queryClient,
  children,
}: {
  queryClient: QueryClient;
  children: ReactNode;
}) {
  useState(() => {
    // A 401 anywhere means the session ended: forget the user so guards send them to sign-in.
    setUnauthenticatedHandler(() => queryClient.setQueryData(authKeys.me(), null));
    return null;
  });
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
