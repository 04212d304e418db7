import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Pattern } from '@/types/api';
import { patternKeys } from './keys';

export const getPattern = async (id: number, signal?: AbortSignal) =>
  (await apiGet<{ pattern: Pattern }>(`/patterns/${id}`, undefined, signal)).pattern;

export const patternQueryOptions = (id: number) =>
  // A missing pattern is shown on the page itself, not as a toast.
  queryOptions({
    queryKey: patternKeys.detail(id),
    queryFn: ({ signal }) => getPattern(id, signal),
    meta: { silent: true },
  });

export const usePattern = (id: number) => useQuery(patternQueryOptions(id));
