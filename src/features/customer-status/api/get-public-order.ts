import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PublicOrder } from '@shared/schemas/shipping';
import { portalKeys } from './portal-keys';

export const publicOrderQueryOptions = (token: string, confirming = false) =>
  queryOptions({
    queryKey: portalKeys.order(token),
    queryFn: () => api.get<PublicOrder>(`/public/orders/${encodeURIComponent(token)}`),
    // back from the payment page: ask again every few seconds until the payment shows
    refetchInterval: (q) => (confirming && q.state.data?.status === 'awaiting_payment' ? 3_000 : 300_000),
    refetchOnWindowFocus: false,
    retry: (n, err) => n < 2 && !(err as { status?: number }).status,
  });
export const usePublicOrder = (token: string, confirming = false) => useQuery(publicOrderQueryOptions(token, confirming));
