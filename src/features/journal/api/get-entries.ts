import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { JournalEntry } from '@/types/api';
import { journalKeys, type EntryFilters } from './keys';

export const getEntries = async (projectId: number, filters: EntryFilters = {}, signal?: AbortSignal) =>
  (await apiGet<{ entries: JournalEntry[] }>(`/projects/${projectId}/entries`, { pieceId: filters.pieceId }, signal)).entries;

export const entriesQueryOptions = (projectId: number, filters: EntryFilters = {}) =>
  queryOptions({ queryKey: journalKeys.list(projectId, filters), queryFn: ({ signal }) => getEntries(projectId, filters, signal) });

export const useEntries = (projectId: number, filters: EntryFilters = {}) => useQuery(entriesQueryOptions(projectId, filters));
