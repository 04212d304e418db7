import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { ShareStatus } from '@/types/showcase';
import { shareKeys } from './keys';

export const getShareStatus = (projectId: number, signal?: AbortSignal) => apiGet<{ share: ShareStatus }>(`/projects/${projectId}/share`, undefined, signal).then((r) => r.share);

export const shareStatusQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: shareKeys.status(projectId), queryFn: ({ signal }) => getShareStatus(projectId, signal) });

export const useShareStatus = (projectId: number) => useQuery(shareStatusQueryOptions(projectId));
