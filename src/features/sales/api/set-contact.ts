import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderContactInput, SalesOrderDetail } from '@shared/schemas/shipping';
import { salesKeys } from './sales-keys';

export function useSetContact(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: OrderContactInput) => api.put<SalesOrderDetail>(`/orders/${orderId}/contact`, body),
    onSuccess: (detail) => {
      qc.setQueryData(salesKeys.order(orderId), detail);
      return qc.invalidateQueries({ queryKey: salesKeys.all });
    },
  });
}

export function useSendProof(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (revision: number) => api.post<{ to: string }>(`/orders/${orderId}/proofs/${revision}/send`),
    onSuccess: () => qc.invalidateQueries({ queryKey: salesKeys.order(orderId) }),
  });
}
