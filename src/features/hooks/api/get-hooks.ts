import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { RollHook } from '@/types/hooks';
import { hookKeys } from './keys';

export const getHooks = async (signal?: AbortSignal) => (await apiGet<{ hooks: RollHook[] }>('/hooks', undefined, signal)).hooks;

export const hooksQueryOptions = () => queryOptions({ queryKey: hookKeys.list(), queryFn: ({ signal }) => getHooks(signal) });

export const useHookRoll = () => useQuery(hooksQueryOptions());
