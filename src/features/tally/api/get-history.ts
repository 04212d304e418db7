import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Position } from '@/schemas/progress-position';
import { tallyKeys } from './keys';

/** The server's undo stack (positions before each event still counting, newest last) at `version`. */
export interface ProgressHistory {
  version: number;
  undo: Position[];
}

export const getHistory = (pieceId: number, signal?: AbortSignal) =>
  apiGet<ProgressHistory>(`/pieces/${pieceId}/progress/history`, undefined, signal);

export const historyQueryOptions = (pieceId: number) =>
  queryOptions({
    queryKey: tallyKeys.history(pieceId),
    queryFn: ({ signal }) => getHistory(pieceId, signal),
    staleTime: 0,
    meta: { silent: true },
  });

export const useHistory = (pieceId: number) => useQuery(historyQueryOptions(pieceId));
