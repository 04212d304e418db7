import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import type { Placement } from '@/types/api';
import { tallyKeys } from './keys';

export const deletePlacement = (id: number) => apiDelete<void>(`/placements/${id}`);

export function useDeletePlacement(pieceId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deletePlacement,
    onSuccess: (_r, id) => {
      qc.setQueryData<Placement[]>(tallyKeys.placements(pieceId), (old) => old?.filter((p) => p.id !== id));
      void qc.invalidateQueries({ queryKey: tallyKeys.placements(pieceId) });
    },
  });
}
