// Renders the real route table in memory, with the app's QueryClient wiring but no retries.
import { QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { createAppQueryClient } from '../../../src/app/provider';
import { createRoutes } from '../../../src/app/router';

/** Opens the app at `path`; returns the router so tests can read where it went. */
export function renderApp(path: string) {
  const queryClient = createAppQueryClient();
  // Source: TanStack Query testing guide — a fresh client per test with retries off.
  queryClient.setDefaultOptions({ queries: { retry: false, staleTime: 0, gcTime: Infinity }, mutations: { retry: false } });
  const router = createMemoryRouter(createRoutes(), { initialEntries: [path] });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...view, router, queryClient, location: () => router.state.location.pathname + router.state.location.search };
}
