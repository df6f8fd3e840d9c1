import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CostingReport, OrderCosting } from '@shared/schemas/order-costing';

export const costingKeys = {
  all: ['costing'] as const,
  order: (id: string) => [...costingKeys.all, 'order', id] as const,
  report: (params: Record<string, string>) => [...costingKeys.all, 'report', params] as const,
};

export const orderCostingQueryOptions = (id: string) =>
  queryOptions({ queryKey: costingKeys.order(id), queryFn: () => api.get<OrderCosting>(`/orders/${id}/costing`), staleTime: 60_000 });
export const useOrderCosting = (id: string, enabled = true) => useQuery({ ...orderCostingQueryOptions(id), enabled });

export const costingReportQueryOptions = (params: Record<string, string>) =>
  queryOptions({
    queryKey: costingKeys.report(params),
    queryFn: () => api.get<CostingReport>('/reports/costing', params),
    staleTime: 60_000,
    placeholderData: keepPreviousData,
  });
export const useCostingReport = (params: Record<string, string>) => useQuery(costingReportQueryOptions(params));

/** The CSV of the same report with the same filters. */
export function costingCsvUrl(params: Record<string, string>): string {
  const s = new URLSearchParams(Object.entries(params).filter(([, v]) => v !== '')).toString();
  return `/api/reports/costing.csv${s ? `?${s}` : ''}`;
}
