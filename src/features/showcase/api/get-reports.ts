import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Report } from '@/types/showcase';
import { reportKeys } from './keys';

export type ReportFilter = 'open' | 'handled' | 'all';

export const getReports = (status: ReportFilter, signal?: AbortSignal) => apiGet<{ reports: Report[] }>('/admin/reports', { status }, signal).then((r) => r.reports);

export const reportsQueryOptions = (status: ReportFilter) => queryOptions({ queryKey: reportKeys.list(status), queryFn: ({ signal }) => getReports(status, signal) });

export const useReports = (status: ReportFilter) => useQuery(reportsQueryOptions(status));
