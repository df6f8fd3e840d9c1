import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SalesOrderDetail } from '@shared/schemas/shipping';
import { salesKeys } from './sales-keys';

export const salesOrderQueryOptions = (id: string) =>
  queryOptions({ queryKey: salesKeys.order(id), queryFn: () => api.get<SalesOrderDetail>(`/sales/orders/${id}`), refetchInterval: 30_000 });
export const useSalesOrder = (id: string) => useQuery(salesOrderQueryOptions(id));

export const ownersQueryOptions = () =>
  queryOptions({ queryKey: salesKeys.owners(), queryFn: () => api.get<{ id: string; name: string; role: string }[]>('/sales/owners'), staleTime: 300_000 });
export const useOwners = () => useQuery(ownersQueryOptions());
