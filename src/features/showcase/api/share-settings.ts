import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPatch } from '@/lib/api-client';
import type { ShareSettings } from '@/schemas/share';
import { shareKeys } from './keys';

export const getShareSettings = (signal?: AbortSignal) => apiGet<{ settings: ShareSettings }>('/share-settings', undefined, signal).then((r) => r.settings);

export const shareSettingsQueryOptions = () => queryOptions({ queryKey: shareKeys.settings(), queryFn: ({ signal }) => getShareSettings(signal) });

export const useShareSettings = () => useQuery(shareSettingsQueryOptions());

export const updateShareSettings = (input: ShareSettings) => apiPatch<{ settings: ShareSettings }>('/share-settings', input).then((r) => r.settings);

export function useUpdateShareSettings() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateShareSettings, onSuccess: (settings) => qc.setQueryData(shareKeys.settings(), settings) });
}
