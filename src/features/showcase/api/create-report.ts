import { useMutation } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { CreateReportInput } from '@/schemas/share';

export { ReportFormSchema } from '@/schemas/share';

/** Always names the page by its link token; `commentId` narrows it to one comment on that page. */
export const createReport = (input: CreateReportInput) => apiPost<{ report: { id: number; status: 'open' } }>('/reports', input).then((r) => r.report);

export function useCreateReport() {
  return useMutation({ mutationFn: createReport, meta: { silent: true } });
}
