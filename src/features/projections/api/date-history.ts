import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DateHistoryPoint } from '@shared/schemas/projections';

export const dateHistoryQueryOptions = (orderId: string) =>
  queryOptions({ queryKey: ['projections', 'date-history', orderId], queryFn: () => api.get<DateHistoryPoint[]>(`/orders/${orderId}/date-history`) });
export const useDateHistory = (orderId: string) => useQuery(dateHistoryQueryOptions(orderId));
