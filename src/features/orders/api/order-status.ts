import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderDetail } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

/** Hold, resume or cancel an order that is not on the floor yet. */
export function useOrderStatus(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (change: { action: 'hold' | 'cancel'; reason: string } | { action: 'resume' }) =>
      api.post<OrderDetail>(`/orders/${orderId}/${change.action}`, 'reason' in change ? { reason: change.reason } : {}),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}
