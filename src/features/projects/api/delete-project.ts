import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { projectKeys } from './keys';

export const deleteProject = (id: number) => apiDelete<void>(`/projects/${id}`);

export function useDeleteProject(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => deleteProject(id),
    // The detail is dropped by the screen once it has moved away, so the open page does not refetch a 404.
    onSuccess: () => qc.invalidateQueries({ queryKey: projectKeys.lists() }),
  });
}
