import { apiPost } from '@/lib/api-client';
import { PlacementInputSchema, type PlacementInput } from '@/schemas/progress';
import type { Placement } from '@/types/api';

export { PlacementInputSchema };

/** Sends one queued mark; the outbox calls it, so a mark made offline is kept and sent later. */
export const createPlacement = async (pieceId: number, input: PlacementInput) =>
  (await apiPost<{ placement: Placement }>(`/pieces/${pieceId}/placements`, input)).placement;
