import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderListItem } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

export const ordersQueryOptions = () => queryOptions({ queryKey: ordersKeys.list(), queryFn: () => api.get<OrderListItem[]>('/orders') });
export const useOrders = () => useQuery(ordersQueryOptions());
