import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { ShareStatus } from '@/types/showcase';
import { shareKeys, showcaseKeys } from './keys';

/** Makes a new link; the old one stops working at once. */
export const newShareLink = (projectId: number) => apiPost<{ shareUrl: string | null; share: ShareStatus }>(`/projects/${projectId}/share-link`, {});

export function useNewShareLink(projectId: number, onChanged?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => newShareLink(projectId),
    onSuccess: ({ share }) => {
      qc.setQueryData(shareKeys.status(projectId), share);
      qc.removeQueries({ queryKey: showcaseKeys.details() });
      onChanged?.();
    },
  });
}
