import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderDetail, OrderSpec, OrderSpecPatch } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

export function useCreateOrder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: OrderSpec) => api.post<OrderDetail>('/orders', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}

export function useUpdateOrder(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (patch: OrderSpecPatch) => api.patch<OrderDetail>(`/orders/${id}`, patch),
    onSuccess: (order) => {
      qc.setQueryData(ordersKeys.detail(id), order);
      return qc.invalidateQueries({ queryKey: ordersKeys.all });
    },
  });
}
