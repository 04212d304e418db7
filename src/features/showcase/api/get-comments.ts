import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { ShowcaseComment } from '@/types/showcase';
import { showcaseKeys } from './keys';

export const getComments = (token: string, signal?: AbortSignal) =>
  apiGet<{ comments: ShowcaseComment[] }>(`/share/${encodeURIComponent(token)}/comments`, undefined, signal).then((r) => r.comments);

export const commentsQueryOptions = (token: string) =>
  queryOptions({ queryKey: showcaseKeys.comments(token), queryFn: ({ signal }) => getComments(token, signal) });

export const useComments = (token: string, enabled = true) => useQuery({ ...commentsQueryOptions(token), enabled });
