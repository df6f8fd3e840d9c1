import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AcceptQuoteBody, AcceptQuoteResult, PublicQuote } from '@shared/schemas/quotes';

const base = (token: string) => `/public/quotes/${encodeURIComponent(token)}`;
export const publicQuoteKey = (token: string) => ['portal', 'quote', token] as const;

export const publicQuoteQueryOptions = (token: string) =>
  queryOptions({
    queryKey: publicQuoteKey(token),
    queryFn: () => api.get<PublicQuote>(base(token)),
    refetchOnWindowFocus: false,
    retry: (n, err) => n < 2 && !(err as { status?: number }).status,
  });
export const usePublicQuote = (token: string) => useQuery(publicQuoteQueryOptions(token));

/** The customer accepts one quantity with her name: the order is placed from the quote. */
export function useAcceptQuote(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptQuoteBody) => api.post<AcceptQuoteResult>(`${base(token)}/accept`, body),
    onSettled: () => qc.invalidateQueries({ queryKey: publicQuoteKey(token) }),
  });
}
