import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { ShowcaseComment } from '@/types/showcase';
import { showcaseKeys } from './keys';

/** Only the page's owner may hide; the comment is addressed through the page's link, like every comment change. */
export const setCommentHidden = (token: string, id: number, hidden: boolean) =>
  apiPatch<{ comment: ShowcaseComment }>(`/share/${encodeURIComponent(token)}/comments/${id}`, { hidden }).then((r) => r.comment);

export function useSetCommentHidden(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, hidden }: { id: number; hidden: boolean }) => setCommentHidden(token, id, hidden),
    onSuccess: () => qc.invalidateQueries({ queryKey: showcaseKeys.detail(token) }),
  });
}
