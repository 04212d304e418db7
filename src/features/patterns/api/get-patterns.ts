import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { PatternListItem } from '@/types/api';
import { patternKeys } from './keys';

export const getPatterns = async (signal?: AbortSignal) =>
  (await apiGet<{ patterns: PatternListItem[] }>('/patterns', undefined, signal)).patterns;

export const patternsQueryOptions = () =>
  queryOptions({ queryKey: patternKeys.list(), queryFn: ({ signal }) => getPatterns(signal) });

export const usePatterns = () => useQuery(patternsQueryOptions());
