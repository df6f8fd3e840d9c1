import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { QuoteBody, QuoteListItem, QuoteView } from '@shared/schemas/quotes';

export const quotesKeys = {
  all: ['quotes'] as const,
  list: () => [...quotesKeys.all, 'list'] as const,
  detail: (id: string) => [...quotesKeys.all, 'detail', id] as const,
};

export const quotesQueryOptions = () => queryOptions({ queryKey: quotesKeys.list(), queryFn: () => api.get<QuoteListItem[]>('/quotes') });
export const useQuotes = () => useQuery(quotesQueryOptions());

export const quoteQueryOptions = (id: string) => queryOptions({ queryKey: quotesKeys.detail(id), queryFn: () => api.get<QuoteView>(`/quotes/${id}`) });
export const useQuote = (id: string, enabled = true) => useQuery({ ...quoteQueryOptions(id), enabled });

export function useCreateQuote() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: QuoteBody) => api.post<QuoteView>('/quotes', body),
    onSuccess: (q) => {
      qc.setQueryData(quotesKeys.detail(q.id), q);
      void qc.invalidateQueries({ queryKey: quotesKeys.list() });
    },
  });
}

/** A changed quote is a new version; the old one is kept. */
export function useReviseQuote(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: QuoteBody) => api.put<QuoteView>(`/quotes/${id}`, body),
    onSuccess: (q) => {
      qc.setQueryData(quotesKeys.detail(id), q);
      void qc.invalidateQueries({ queryKey: quotesKeys.list() });
    },
  });
}

export function useSendQuote(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<{ url: string }>(`/quotes/${id}/send`, {}),
    onSuccess: () => qc.invalidateQueries({ queryKey: quotesKeys.all }),
  });
}

export function useWithdrawQuoteLink(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<void>(`/quotes/${id}/share`),
    onSuccess: () => qc.invalidateQueries({ queryKey: quotesKeys.detail(id) }),
  });
}

export const quotePdfUrl = (id: string) => `/api/quotes/${id}/quote.pdf`;
