import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PackCartonsInput, PackingView } from '@shared/schemas/shipping';
import { shippingKeys } from './shipping-keys';

export function usePackCartons(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PackCartonsInput) => api.post<PackingView>(`/orders/${orderId}/cartons`, body),
    onSuccess: (view) => {
      qc.setQueryData(shippingKeys.packing(orderId), view);
      return qc.invalidateQueries({ queryKey: shippingKeys.all });
    },
  });
}

export function useRemoveCarton(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (cartonId: string) => api.delete<PackingView>(`/orders/${orderId}/cartons/${cartonId}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: shippingKeys.all }),
  });
}
