import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { patternKeys } from './keys';

export const deletePattern = (id: number) => apiDelete<void>(`/patterns/${id}`);

export function useDeletePattern() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deletePattern,
    onSuccess: (_v, id) => {
      qc.removeQueries({ queryKey: patternKeys.detail(id) });
      return qc.invalidateQueries({ queryKey: patternKeys.lists() });
    },
  });
}
