import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { Providers } from './providers';
import { createQueryClient } from './queryClient';
import { createRouter } from './router';

export function App() {
  const [queryClient] = useState(createQueryClient);
  const [router] = useState(() => createRouter(queryClient));
  return (
    <Providers queryClient={queryClient}>
      <RouterProvider router={router} />
    </Providers>
  );
}
