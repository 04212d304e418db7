import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CheerSummary, Showcase } from '@/types/showcase';
import { showcaseKeys } from './keys';

/** POST adds the member's one cheer, DELETE takes it back; both answer with the new count. */
export const setCheer = (token: string, cheered: boolean) =>
  api<{ cheers: CheerSummary }>(`/share/${encodeURIComponent(token)}/cheer`, { method: cheered ? 'POST' : 'DELETE', body: cheered ? {} : undefined }).then((r) => r.cheers);

export function useSetCheer(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (cheered: boolean) => setCheer(token, cheered),
    onSuccess: (cheers) => qc.setQueryData<Showcase>(showcaseKeys.detail(token), (old) => (old ? { ...old, cheers } : old)),
  });
}
