import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { ShelfYarn } from '@/types/api';
import { yarnKeys } from './keys';

export const getYarns = async (signal?: AbortSignal) => (await apiGet<{ yarns: ShelfYarn[] }>('/yarns', undefined, signal)).yarns;

export const yarnsQueryOptions = () => queryOptions({ queryKey: yarnKeys.list(), queryFn: ({ signal }) => getYarns(signal) });

export const useYarns = () => useQuery(yarnsQueryOptions());
