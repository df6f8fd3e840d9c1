import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SalesOrderRow } from '@shared/schemas/shipping';
import { salesKeys } from './sales-keys';

export const salesSearchQueryOptions = (q = '') =>
  queryOptions({
    queryKey: salesKeys.search(q),
    queryFn: () => api.get<SalesOrderRow[]>('/sales/orders', { q, limit: 100 }),
    placeholderData: keepPreviousData,
  });
export const useSalesSearch = (q: string) => useQuery(salesSearchQueryOptions(q));
