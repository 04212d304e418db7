import { render } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { createQueryClient } from '@/lib/query-client';
import { routes } from '@/app/router';

const clients = new Set<QueryClient>();

/** Renders the real routes at `path` with the real providers; only the network is mocked. */
export function renderRoute(path: string) {
  const queryClient = createQueryClient();
  clients.add(queryClient);
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const utils = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...utils, router, queryClient };
}

/** Drops every query the test's pages made, cancelling retries that would otherwise fire during the next test. */
export function clearQueryClients() {
  for (const client of clients) client.clear();
  clients.clear();
}
