import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { yarnKeys } from './keys';

export const deleteYarn = (id: number) => apiDelete<void>(`/yarns/${id}`);

export function useDeleteYarn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteYarn,
    onSuccess: () => qc.invalidateQueries({ queryKey: yarnKeys.lists() }),
  });
}
