import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PackingView } from '@shared/schemas/shipping';
import { shippingKeys } from './shipping-keys';

export const packingQueryOptions = (orderId: string) =>
  queryOptions({ queryKey: shippingKeys.packing(orderId), queryFn: () => api.get<PackingView>(`/orders/${orderId}/packing`), refetchInterval: 15_000 });
export const usePacking = (orderId: string) => useQuery(packingQueryOptions(orderId));
