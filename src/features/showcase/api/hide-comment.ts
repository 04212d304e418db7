import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { ShowcaseComment } from '@/types/showcase';
import { showcaseKeys } from './keys';

export const setCommentHidden = (id: number, hidden: boolean) => apiPatch<{ comment: ShowcaseComment }>(`/comments/${id}`, { hidden }).then((r) => r.comment);

export function useSetCommentHidden(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, hidden }: { id: number; hidden: boolean }) => setCommentHidden(id, hidden),
    onSuccess: () => qc.invalidateQueries({ queryKey: showcaseKeys.detail(token) }),
  });
}
