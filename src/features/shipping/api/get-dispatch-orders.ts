import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DispatchRow } from '@shared/schemas/shipping';
import { shippingKeys } from './shipping-keys';

export const dispatchOrdersQueryOptions = (q = '') =>
  queryOptions({ queryKey: shippingKeys.list(q), queryFn: () => api.get<DispatchRow[]>('/dispatch/orders', { q }), placeholderData: keepPreviousData });
export const useDispatchOrders = (q: string) => useQuery(dispatchOrdersQueryOptions(q));
