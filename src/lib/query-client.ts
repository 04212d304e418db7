import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { ApiError } from './api-client';

/** The one place that shows error toasts: queries and mutations that fail, unless they opt out via meta. */
function reportError(error: unknown, meta?: Record<string, unknown>) {
  if (meta?.silent) return;
  if (error instanceof ApiError && error.status === 401) return; // the route guard sends the member to sign in
  toast.error(error instanceof Error ? error.message : 'Something went wrong.');
}

export function createQueryClient() {
  return new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => reportError(error, query.meta) }),
    mutationCache: new MutationCache({ onError: (error, _v, _c, mutation) => reportError(error, mutation.meta) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false },
    },
  });
}
