import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { del, get, set } from 'idb-keyval';
import { toast } from 'sonner';
import { ApiError } from './api-client';

// Kept on the device (IndexedDB) so a cold start with no signal still passes the sign-in guard and shows the
// Tally's round: the signed-in member, what the Tally reads, and the projects it belongs to. Nothing else.
export const PERSIST_MAX_AGE = 14 * 24 * 60 * 60_000;
export const PERSIST_BUSTER = 'whorlbook-1';
const persistedRoots: ReadonlyArray<readonly unknown[]> = [['auth', 'me'], ['tally'], ['projects', 'detail']];
const underRoot = (key: readonly unknown[]) => persistedRoots.some((root) => root.every((part, i) => key[i] === part));

// Typed by shape: the persister packages bring their own copy of query-core's types.
export function shouldPersistQuery(query: { state: { status: string; data?: unknown }; queryKey: readonly unknown[] }) {
  // "Signed out" is never kept: a stale copy of it, restored right after signing in, would send the member back
  // to the sign-in page.
  if (query.queryKey[0] === 'auth' && query.state.data == null) return false;
  return query.state.status === 'success' && underRoot(query.queryKey);
}

/** The IndexedDB persister for the query cache, or null where the browser has no IndexedDB. */
export function createQueryPersister() {
  if (typeof indexedDB === 'undefined') return null;
  return createAsyncStoragePersister({
    key: 'whorlbook.query-cache',
    throttleTime: 500,
    storage: {
      getItem: async (key) => (await get<string>(key)) ?? null,
      setItem: (key, value) => set(key, value),
      removeItem: (key) => del(key),
    },
  });
}

/** The one place that shows error toasts: queries and mutations that fail, unless they opt out via meta. */
function reportError(error: unknown, meta?: Record<string, unknown>) {
  if (meta?.silent) return;
  if (error instanceof ApiError && error.status === 401) return; // the route guard sends the member to sign in
  toast.error(error instanceof Error ? error.message : 'Something went wrong.');
}

export function createQueryClient() {
  const client = new QueryClient({
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
  // A persisted query must outlive the persisted copy, or it is dropped from the cache (and so from the device)
  // five minutes after its screen closes.
  for (const root of persistedRoots) client.setQueryDefaults(root, { gcTime: PERSIST_MAX_AGE });
  return client;
}
