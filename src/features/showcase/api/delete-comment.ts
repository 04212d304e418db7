import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { showcaseKeys } from './keys';

/** A comment is changed only through the page it is on, so the link's token is part of the address. */
export const deleteComment = (token: string, id: number) => apiDelete<void>(`/share/${encodeURIComponent(token)}/comments/${id}`);

export function useDeleteComment(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => deleteComment(token, id),
    onSuccess: () => qc.invalidateQueries({ queryKey: showcaseKeys.detail(token) }),
  });
}
