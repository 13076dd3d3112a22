import { useState } from 'react';
import { RouterProvider } from 'react-router';
import { createQueryClient } from '@/lib/query-client';
import { AppProvider } from './provider';
import { createRouter } from './router';

export function App() {
  const [queryClient] = useState(createQueryClient);
  const [router] = useState(() => createRouter(queryClient));
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
