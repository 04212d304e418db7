import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { hookKeys } from './keys';

export const deleteHook = (id: number) => apiDelete<void>(`/hooks/${id}`);

export function useDeleteHook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteHook,
    onSuccess: () => qc.invalidateQueries({ queryKey: hookKeys.lists() }),
  });
}
