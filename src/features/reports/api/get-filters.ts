import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { reportsKeys } from './reports-keys';

export const filtersQueryOptions = () =>
  queryOptions({ queryKey: reportsKeys.filters(), queryFn: () => api.get<{ customers: { id: string; name: string }[] }>('/reports/filters'), staleTime: 5 * 60_000 });
export const useReportFilterOptions = () => useQuery(filtersQueryOptions());
