import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import { shareKeys } from './keys';

export type Visibility = 'private' | 'link' | 'public';

/** The projects API owns visibility (PATCH /api/projects/:id); the first share there makes the link. */
export const setVisibility = (projectId: number, visibility: Visibility) =>
  apiPatch<{ project: { id: number; visibility: Visibility; shareUrl: string | null } }>(`/projects/${projectId}`, { visibility }).then((r) => r.project);

export function useSetVisibility(projectId: number, onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (visibility: Visibility) => setVisibility(projectId, visibility),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: shareKeys.status(projectId) });
      onChanged?.();
    },
  });
}
