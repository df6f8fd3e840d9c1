import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { reportsKeys } from './reports-keys';

export interface ReportFilterOptions {
  customers: { id: string; name: string }[];
  /** the last factory day with scans (null on an empty floor) */
  lastDataDay: string | null;
}

export const filtersQueryOptions = () =>
  queryOptions({ queryKey: reportsKeys.filters(), queryFn: () => api.get<ReportFilterOptions>('/reports/filters'), staleTime: 5 * 60_000 });
export const useReportFilterOptions = () => useQuery(filtersQueryOptions());
