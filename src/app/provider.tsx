import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { sessionQueryOptions } from '../features/auth/api/get-session';
import { createQueryClient } from '../lib/query-client';

/** The app's QueryClient: a 401 anywhere means the session ended, so the cache forgets the user and the sign-in guard takes over. */
export function createAppQueryClient(): QueryClient {
  const client = createQueryClient({
    onUnauthorized: () => client.setQueryData(sessionQueryOptions().queryKey, { user: null }),
  });
  return client;
}

/** App-wide state holders. */
export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createAppQueryClient);
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
