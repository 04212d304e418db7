import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Placement } from '@/types/api';
import { tallyKeys } from './keys';

export const getPlacements = async (pieceId: number, signal?: AbortSignal) =>
  (await apiGet<{ placements: Placement[] }>(`/pieces/${pieceId}/placements`, undefined, signal)).placements;

export const placementsQueryOptions = (pieceId: number) =>
  queryOptions({
    queryKey: tallyKeys.placements(pieceId),
    queryFn: ({ signal }) => getPlacements(pieceId, signal),
    meta: { silent: true },
  });

export const usePlacements = (pieceId: number) => useQuery(placementsQueryOptions(pieceId));
