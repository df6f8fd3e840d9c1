import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PublicOrder } from '@shared/schemas/shipping';
import type { CheckoutAnswer, PortalApproveBody, PortalChangesBody } from '@shared/schemas/payments';
import { portalKeys } from './portal-keys';

const base = (token: string) => `/public/orders/${encodeURIComponent(token)}`;

/** Opens a hosted checkout for what is due and goes there. */
export function useStartCheckout(token: string) {
  return useMutation({
    mutationFn: () => api.post<CheckoutAnswer>(`${base(token)}/checkout`, {}),
    onSuccess: ({ url }) => window.location.assign(url),
  });
}

export function useApproveProof(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revision, body }: { revision: number; body: PortalApproveBody }) => api.post<PublicOrder>(`${base(token)}/proofs/${revision}/approve`, body),
    onSuccess: (data) => qc.setQueryData(portalKeys.order(token), data),
  });
}

export function useAskForChanges(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revision, body }: { revision: number; body: PortalChangesBody }) => api.post<PublicOrder>(`${base(token)}/proofs/${revision}/changes`, body),
    onSuccess: (data) => qc.setQueryData(portalKeys.order(token), data),
  });
}
