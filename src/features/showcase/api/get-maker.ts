import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { MakerProfile } from '@/types/showcase';
import { showcaseKeys } from './keys';

export const getMaker = (id: string, signal?: AbortSignal) => apiGet<MakerProfile>(`/makers/${encodeURIComponent(id)}`, undefined, signal);

export const makerQueryOptions = (id: string) =>
  queryOptions({ queryKey: showcaseKeys.maker(id), queryFn: ({ signal }) => getMaker(id, signal), meta: { silent: true } });

export const useMaker = (id: string) => useQuery(makerQueryOptions(id));
