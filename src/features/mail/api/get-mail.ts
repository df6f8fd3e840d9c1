import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CaughtMail, MailQueueItem } from '@shared/schemas/shipping';
import { mailKeys } from './mail-keys';

export const caughtMailQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.caught(), queryFn: () => api.get<CaughtMail[]>('/mail'), refetchInterval: 10_000 });
export const useCaughtMail = () => useQuery(caughtMailQueryOptions());

export const mailQueueQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.queue(), queryFn: () => api.get<MailQueueItem[]>('/mail/queue', { limit: 50 }), refetchInterval: 10_000 });
export const useMailQueue = () => useQuery(mailQueueQueryOptions());

export function useRetryMail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<void>(`/mail/queue/${id}/retry`),
    onSuccess: () => qc.invalidateQueries({ queryKey: mailKeys.all }),
  });
}

export function useQueueLateDigest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<{ date: string; orders: number; queued: number }>('/mail/late-digest'),
    onSuccess: () => qc.invalidateQueries({ queryKey: mailKeys.all }),
  });
}
