import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { journalKeys } from './keys';

export const deleteEntry = (entryId: number) => apiDelete<void>(`/entries/${entryId}`);

export function useDeleteEntry(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (entryId: number) => deleteEntry(entryId),
    onSuccess: () => qc.invalidateQueries({ queryKey: journalKeys.project(projectId) }),
  });
}
