import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { PieceProgress } from '@/types/api';
import { tallyKeys } from './keys';

export const getProgress = async (pieceId: number, signal?: AbortSignal) =>
  (await apiGet<{ progress: PieceProgress }>(`/pieces/${pieceId}/progress`, undefined, signal)).progress;

export const progressQueryOptions = (pieceId: number) =>
  queryOptions({
    queryKey: tallyKeys.progress(pieceId),
    queryFn: ({ signal }) => getProgress(pieceId, signal),
    // Answers from the server replace the cached position only when they are newer (see acceptProgress), so a
    // background refetch is always safe; the stream keeps it fresh anyway.
    staleTime: 5_000,
    meta: { silent: true },
  });

export const useProgress = (pieceId: number) => useQuery(progressQueryOptions(pieceId));

/**
 * Takes a position from the server (a POST answer, the stream, a refetch) unless the cache already holds a
 * newer one: answers can arrive out of order, and the count must never slide back except by an undo,
 * which arrives with a higher version like every other event.
 */
export function acceptProgress(qc: QueryClient, pieceId: number, progress: PieceProgress) {
  qc.setQueryData<PieceProgress>(tallyKeys.progress(pieceId), (old) =>
    !old || progress.version >= old.version ? progress : old,
  );
}
