import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { showcaseKeys } from './keys';

export const deleteComment = (id: number) => apiDelete<void>(`/comments/${id}`);

export function useDeleteComment(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteComment,
    onSuccess: () => qc.invalidateQueries({ queryKey: showcaseKeys.detail(token) }),
  });
}
