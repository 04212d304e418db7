import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { CreateCommentInput } from '@/schemas/share';
import type { ShowcaseComment } from '@/types/showcase';
import { showcaseKeys } from './keys';

export { CreateCommentSchema } from '@/schemas/share';

export const createComment = (token: string, input: CreateCommentInput) =>
  apiPost<{ comment: ShowcaseComment }>(`/share/${encodeURIComponent(token)}/comments`, input).then((r) => r.comment);

export function useCreateComment(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateCommentInput) => createComment(token, input),
    // The form shows the server's sentence (length, rate limit) beside the box.
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: showcaseKeys.detail(token) }),
  });
}
