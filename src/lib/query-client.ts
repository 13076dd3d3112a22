import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/** Defaults set once: no retry on 4xx (they will not change), short stale time. */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        refetchOnWindowFocus: false,
        retry: (count, err) =>
          !(err instanceof ApiError && err.status >= 400 && err.status < 500) && count < 2,
      },
      mutations: { retry: false },
    },
  });
}
