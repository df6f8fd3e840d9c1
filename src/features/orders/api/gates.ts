import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OrderDetail, PaymentBody, ProofApprovalBody } from '@shared/schemas/orders';
import { ordersKeys } from './orders-keys';

/** Record a payment, or a manager's exception. */
export function useRecordPayment(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PaymentBody) => api.post<OrderDetail>(`/orders/${orderId}/payment`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}

export function useUploadProof(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return api.upload<{ revision: number }>(`/orders/${orderId}/proofs`, form);
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}

export function useApproveProof(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revision, body }: { revision: number; body: ProofApprovalBody }) =>
      api.post<OrderDetail>(`/orders/${orderId}/proofs/${revision}/approve`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: ordersKeys.all }),
  });
}

export const proofFileUrl = (orderId: string, revision: number) => `/api/orders/${orderId}/proofs/${revision}/file`;
