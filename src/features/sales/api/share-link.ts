import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShareLink } from '@shared/schemas/shipping';
import { salesKeys } from './sales-keys';

export function useCreateShareLink(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<ShareLink>(`/orders/${orderId}/share`),
    onSuccess: () => qc.invalidateQueries({ queryKey: salesKeys.order(orderId) }),
  });
}

export function useRevokeShareLinks(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<void>(`/orders/${orderId}/share`),
    onSuccess: () => qc.invalidateQueries({ queryKey: salesKeys.order(orderId) }),
  });
}
