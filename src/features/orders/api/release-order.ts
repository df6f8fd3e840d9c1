import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReleaseBody, ReleaseResult } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

export function useReleaseOrder(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ReleaseBody) => api.post<ReleaseResult>(`/orders/${orderId}/release`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}

/** The travellers PDF of an order (all, or chosen travellers) in a sheet layout. */
export function travellersPdfUrl(orderId: string, layout: string, ids?: string[]): string {
  const q = new URLSearchParams({ layout });
  if (ids?.length) q.set('ids', ids.join(','));
  return `/api/orders/${orderId}/travellers.pdf?${q.toString()}`;
}
