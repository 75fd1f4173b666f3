'use client';

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';

/** One TanStack Query client per browser tab, for the client-fetched views (the board). */
export function QueryProvider({ children }: { children: ReactNode }) {
  const [client] = useState(
    () => new QueryClient({ defaultOptions: { queries: { staleTime: 2_000, retry: 2 } } }),
  );
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
