import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, apiGet } from '@/lib/api-client';

export interface OutboxMessage {
  to: string;
  subject: string;
  text: string;
  html: string | null;
  date: string;
}

export const outboxKeys = {
  all: ['dev-outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
};

/** What the built-in mail fake received, newest last; null when this server sends real e-mail (no outbox route). */
export async function getOutbox(signal?: AbortSignal): Promise<OutboxMessage[] | null> {
  try {
    return await apiGet<OutboxMessage[]>('/dev/outbox', undefined, signal);
  } catch (e) {
    if (e instanceof ApiError && e.status === 404) return null;
    throw e;
  }
}

export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: outboxKeys.list(),
    queryFn: ({ signal }) => getOutbox(signal),
    // New mail shows up by itself while the page is open: a person is usually waiting for one message.
    refetchInterval: (query) => (query.state.data === null ? false : 3000),
    staleTime: 0,
  });

export const useOutbox = () => useQuery(outboxQueryOptions());
