import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Showcase } from '@/types/showcase';
import { showcaseKeys } from './keys';

export const getShowcase = (token: string, signal?: AbortSignal) => apiGet<{ showcase: Showcase }>(`/share/${encodeURIComponent(token)}`, undefined, signal).then((r) => r.showcase);

export const showcaseQueryOptions = (token: string) =>
  queryOptions({
    queryKey: showcaseKeys.detail(token),
    queryFn: ({ signal }) => getShowcase(token, signal),
    // A 404 is the page's own answer ("not shared"), shown on the page rather than as a toast.
    meta: { silent: true },
  });

export const useShowcase = (token: string) => useQuery(showcaseQueryOptions(token));
