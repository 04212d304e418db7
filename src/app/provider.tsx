import { Component, useState, type ErrorInfo, type ReactNode } from 'react';
import { QueryClientProvider, useQuery } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { Toaster } from 'sonner';
import { createQueryClient, createQueryPersister, PERSIST_BUSTER, PERSIST_MAX_AGE, shouldPersistQuery } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { TallyOutboxSync } from '@/features/tally/components/outbox-sync';
import { ErrorFallback } from '@/components/errors/error-fallback';

class ErrorBoundary extends Component<{ children: ReactNode }, { error: unknown }> {
  state = { error: null as unknown };
  static getDerivedStateFromError(error: unknown) {
    return { error };
  }
  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error('Whorlbook screen failed', error, info.componentStack);
  }
  render() {
    return this.state.error ? <ErrorFallback error={this.state.error} /> : this.props.children;
  }
}

/** Sends the Tally's queued taps for whoever is signed in (read from the cache; the route guard fetches it). */
function TallySync() {
  const me = useQuery({ ...meQueryOptions(), enabled: false });
  return <TallyOutboxSync memberId={me.data?.id ?? null} />;
}

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createQueryClient);
  const [persister] = useState(createQueryPersister);
  const inner = (
    <>
      {children}
      <TallySync />
      <Toaster position="top-center" richColors closeButton toastOptions={{ className: 'font-sans' }} />
    </>
  );
  return (
    <ErrorBoundary>
      {persister ? (
        <PersistQueryClientProvider
          client={queryClient}
          persistOptions={{ persister, maxAge: PERSIST_MAX_AGE, buster: PERSIST_BUSTER, dehydrateOptions: { shouldDehydrateQuery: shouldPersistQuery } }}
        >
          {inner}
        </PersistQueryClientProvider>
      ) : (
        <QueryClientProvider client={queryClient}>{inner}</QueryClientProvider>
      )}
    </ErrorBoundary>
  );
}
