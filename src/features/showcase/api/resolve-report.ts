import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { Report } from '@/types/showcase';
import { reportKeys } from './keys';

export const resolveReport = (id: number, action: 'hide' | 'dismiss') => apiPost<{ report: Report }>(`/admin/reports/${id}/resolve`, { action }).then((r) => r.report);

export function useResolveReport() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, action }: { id: number; action: 'hide' | 'dismiss' }) => resolveReport(id, action),
    // Hiding closes every open report on the same thing, so the whole list is stale.
    onSuccess: () => qc.invalidateQueries({ queryKey: reportKeys.lists() }),
  });
}
