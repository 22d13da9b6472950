import { QueryCache, QueryClient, MutationCache } from '@tanstack/react-query';
import { ApiError } from './api-client';

export interface QueryClientHooks {
  /** Called when any query or mutation meets a 401: the session ended behind our back. */
  onUnauthorized?: () => void;
}

/** Retries only what a retry can fix: the network and the server's own failures, never a refusal. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= 2) return false;
  if (error instanceof ApiError) return error.status === 0 || error.status >= 500;
  return false;
}

/** The app's QueryClient; tests build their own with retries off. */
export function createQueryClient(hooks: QueryClientHooks = {}): QueryClient {
  const onError = (error: unknown) => {
    if (error instanceof ApiError && error.status === 401) hooks.onUnauthorized?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
}
