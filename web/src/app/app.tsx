import { createQueryClient } from '@web/lib/query-client';
import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { AppProviders } from './providers';
import { createAppRouter } from './router';

export function App() {
  // One client and one router for the page's lifetime; loaders and components share the cache.
  const [queryClient] = useState(createQueryClient);
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>
  );
}
