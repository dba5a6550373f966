import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from '@/lib/query-client.ts';

interface AppProvidersProps {
  children: ReactNode;
  /** Tests pass their own client (no retries, fresh cache per test). */
  queryClient?: QueryClient;
}

export function AppProviders({ children, queryClient }: AppProvidersProps) {
  const [defaultClient] = useState(createQueryClient);
  return (
    <QueryClientProvider client={queryClient ?? defaultClient}>{children}</QueryClientProvider>
  );
}
