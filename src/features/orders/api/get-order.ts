import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderDetail } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

export const orderQueryOptions = (id: string) => queryOptions({ queryKey: ordersKeys.detail(id), queryFn: () => api.get<OrderDetail>(`/orders/${id}`) });
export const useOrder = (id: string) => useQuery(orderQueryOptions(id));
